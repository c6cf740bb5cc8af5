ALTER TABLE "calibrations" ADD COLUMN "lens" jsonb;--> statement-breakpoint
ALTER TABLE "calibrations" ADD COLUMN "plane_offset" jsonb;--> statement-breakpoint
ALTER TABLE "calibrations" ADD COLUMN "level_endpoint_sigma_px" double precision;--> statement-breakpoint
ALTER TABLE "calibrations" ADD COLUMN "roll_tol_deg" double precision;--> statement-breakpoint
ALTER TABLE "calibrations" ADD COLUMN "roll_std_uncertainty_rad" double precision DEFAULT 0 NOT NULL;