ALTER TABLE "clips" ADD COLUMN "base_fps" double precision DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "frame_pts_s" double precision[];