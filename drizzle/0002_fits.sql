CREATE TABLE "fits" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"shot_id" uuid NOT NULL,
	"clip_id" uuid NOT NULL,
	"track_id" uuid NOT NULL,
	"calibration_id" uuid NOT NULL,
	"calibration_version" integer NOT NULL,
	"marks_revision" integer NOT NULL,
	"state" text DEFAULT 'awaiting-review' NOT NULL,
	"input_snapshot" jsonb NOT NULL,
	"input_hash" text NOT NULL,
	"result" jsonb NOT NULL,
	"launch_speed_mps" double precision NOT NULL,
	"launch_angle_deg" double precision NOT NULL,
	"drag_coefficient" double precision,
	"drag_k_per_m" double precision,
	"rms_residual_m" double precision NOT NULL,
	"drag_verdict" text NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"reviewed_by" uuid,
	"reviewed_at" timestamp with time zone,
	"review_note" text
);
--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_shot_id_shots_id_fk" FOREIGN KEY ("shot_id") REFERENCES "public"."shots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_reviewed_by_users_id_fk" FOREIGN KEY ("reviewed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "fits_team_idx" ON "fits" USING btree ("team_id","created_at");--> statement-breakpoint
CREATE INDEX "fits_shot_idx" ON "fits" USING btree ("shot_id","created_at");--> statement-breakpoint
CREATE INDEX "fits_track_idx" ON "fits" USING btree ("track_id");