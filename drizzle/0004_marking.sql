CREATE TABLE "calibrations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"clip_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"scale_p1_u_px" double precision NOT NULL,
	"scale_p1_v_px" double precision NOT NULL,
	"scale_p2_u_px" double precision NOT NULL,
	"scale_p2_v_px" double precision NOT NULL,
	"length_m" double precision NOT NULL,
	"length_tol_m" double precision NOT NULL,
	"endpoint_sigma_px" double precision NOT NULL,
	"origin_u_px" double precision NOT NULL,
	"origin_v_px" double precision NOT NULL,
	"level_kind" text NOT NULL,
	"level_p1_u_px" double precision,
	"level_p1_v_px" double precision,
	"level_p2_u_px" double precision,
	"level_p2_v_px" double precision,
	"level_angle_deg" double precision,
	"downrange" text DEFAULT 'right' NOT NULL,
	"roll_deg" double precision NOT NULL,
	"plane_correction" jsonb,
	"pixels_per_metre" double precision NOT NULL,
	"scale_rel_uncertainty" double precision NOT NULL,
	"note" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "calibrations_clip_version_uq" UNIQUE("clip_id","version")
);
--> statement-breakpoint
CREATE TABLE "marks" (
	"track_id" uuid NOT NULL,
	"frame_number" integer NOT NULL,
	"u_px" double precision NOT NULL,
	"v_px" double precision NOT NULL,
	"placed_u_px" double precision NOT NULL,
	"placed_v_px" double precision NOT NULL,
	"snapped" boolean DEFAULT false NOT NULL,
	"revision" integer NOT NULL,
	"updated_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "marks_track_id_frame_number_pk" PRIMARY KEY("track_id","frame_number")
);
--> statement-breakpoint
CREATE TABLE "tracks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"clip_id" uuid NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"kind" text DEFAULT 'projectile' NOT NULL,
	"revision" integer DEFAULT 0 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "calibrations" ADD CONSTRAINT "calibrations_clip_id_clips_id_fk" FOREIGN KEY ("clip_id") REFERENCES "public"."clips"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "calibrations" ADD CONSTRAINT "calibrations_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "marks" ADD CONSTRAINT "marks_track_id_tracks_id_fk" FOREIGN KEY ("track_id") REFERENCES "public"."tracks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "marks" ADD CONSTRAINT "marks_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tracks" ADD CONSTRAINT "tracks_clip_id_clips_id_fk" FOREIGN KEY ("clip_id") REFERENCES "public"."clips"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tracks" ADD CONSTRAINT "tracks_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tracks" ADD CONSTRAINT "tracks_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "tracks_clip_idx" ON "tracks" USING btree ("clip_id","created_at");--> statement-breakpoint
CREATE INDEX "tracks_team_idx" ON "tracks" USING btree ("team_id");