CREATE TABLE "clip_frames" (
	"clip_id" uuid NOT NULL,
	"frame_number" integer NOT NULL,
	"t_s" double precision NOT NULL,
	"pts_s" double precision,
	"flag" text,
	"storage_key" text NOT NULL,
	"size_bytes" integer NOT NULL,
	CONSTRAINT "clip_frames_clip_id_frame_number_pk" PRIMARY KEY("clip_id","frame_number")
);
--> statement-breakpoint
CREATE TABLE "clips" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"shot_id" uuid NOT NULL,
	"original_name" text NOT NULL,
	"sha256" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"storage_key" text NOT NULL,
	"format_name" text NOT NULL,
	"codec" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"rotation_deg" integer DEFAULT 0 NOT NULL,
	"container_fps" double precision NOT NULL,
	"capture_fps" double precision NOT NULL,
	"frame_count" integer NOT NULL,
	"duration_s" double precision NOT NULL,
	"variable_frame_rate" boolean DEFAULT false NOT NULL,
	"time_base_warnings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"duplicate_of_clip_id" uuid,
	"in_frame" integer NOT NULL,
	"out_frame" integer NOT NULL,
	"status" text DEFAULT 'queued' NOT NULL,
	"progress" real DEFAULT 0 NOT NULL,
	"error" text,
	"extracted_count" integer DEFAULT 0 NOT NULL,
	"thumbnail_count" integer DEFAULT 0 NOT NULL,
	"job_id" uuid,
	"heartbeat_at" timestamp with time zone,
	"frames_prefix" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "clip_frames" ADD CONSTRAINT "clip_frames_clip_id_clips_id_fk" FOREIGN KEY ("clip_id") REFERENCES "public"."clips"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_shot_id_shots_id_fk" FOREIGN KEY ("shot_id") REFERENCES "public"."shots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "clips_shot_idx" ON "clips" USING btree ("shot_id","created_at");--> statement-breakpoint
CREATE INDEX "clips_team_sha_idx" ON "clips" USING btree ("team_id","sha256");