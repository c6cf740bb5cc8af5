CREATE TABLE "auto_mark_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"track_id" uuid NOT NULL,
	"clip_id" uuid NOT NULL,
	"state" text DEFAULT 'queued' NOT NULL,
	"progress" real DEFAULT 0 NOT NULL,
	"frames_marked" integer DEFAULT 0 NOT NULL,
	"frames_flagged" integer DEFAULT 0 NOT NULL,
	"launch_frame" integer,
	"end_reason" text,
	"error" text,
	"request" jsonb NOT NULL,
	"review_threshold" double precision NOT NULL,
	"job_id" uuid,
	"attempt" integer DEFAULT 0 NOT NULL,
	"heartbeat_at" timestamp with time zone,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "marks" ADD COLUMN "source" text DEFAULT 'hand' NOT NULL;--> statement-breakpoint
ALTER TABLE "marks" ADD COLUMN "confidence" real;--> statement-breakpoint
ALTER TABLE "marks" ADD COLUMN "low_confidence_reason" text;--> statement-breakpoint
ALTER TABLE "marks" ADD COLUMN "auto_mark_run_id" uuid;--> statement-breakpoint
ALTER TABLE "teams" ADD COLUMN "auto_mark_review_threshold" real DEFAULT 0.6 NOT NULL;--> statement-breakpoint
ALTER TABLE "auto_mark_runs" ADD CONSTRAINT "auto_mark_runs_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "auto_mark_runs" ADD CONSTRAINT "auto_mark_runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "auto_mark_runs_track_idx" ON "auto_mark_runs" USING btree ("track_id","created_at");--> statement-breakpoint
CREATE INDEX "auto_mark_runs_clip_idx" ON "auto_mark_runs" USING btree ("clip_id");--> statement-breakpoint
CREATE UNIQUE INDEX "auto_mark_runs_one_active_per_track" ON "auto_mark_runs" USING btree ("track_id") WHERE state in ('queued', 'running');--> statement-breakpoint
-- Marks made before automatic marking: a person's, snapped or not.
UPDATE "marks" SET "source" = 'snap' WHERE "snapped";