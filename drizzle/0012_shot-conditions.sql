CREATE TABLE "lens_profiles" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"camera_note" text,
	"coefficients" jsonb NOT NULL,
	"frame_width_px" integer NOT NULL,
	"frame_height_px" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "shutter_s" double precision;--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "frame_stamp" text DEFAULT 'middle' NOT NULL;--> statement-breakpoint
ALTER TABLE "shots" ADD COLUMN "wind_speed_mps" double precision;--> statement-breakpoint
ALTER TABLE "shots" ADD COLUMN "wind_from_deg" double precision;--> statement-breakpoint
ALTER TABLE "shots" ADD COLUMN "launch_height_m" double precision;--> statement-breakpoint
ALTER TABLE "shots" ADD COLUMN "air_density_kg_m3" double precision;--> statement-breakpoint
ALTER TABLE "shots" ADD COLUMN "air_density_tol_kg_m3" double precision;--> statement-breakpoint
ALTER TABLE "lens_profiles" ADD CONSTRAINT "lens_profiles_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "lens_profiles_team_idx" ON "lens_profiles" USING btree ("team_id");