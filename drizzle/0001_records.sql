CREATE TABLE "launchers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"kind" text,
	"bore_m" double precision,
	"barrel_length_m" double precision,
	"chamber_volume_m3" double precision,
	"max_working_pressure_pa" double precision,
	"valve_type" text,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "projectiles" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"mass_kg" double precision NOT NULL,
	"diameter_m" double precision NOT NULL,
	"shape" text,
	"reference_area_m2" double precision,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"series_id" uuid NOT NULL,
	"launcher_id" uuid,
	"projectile_id" uuid,
	"label" text NOT NULL,
	"chamber_pressure_pa" double precision,
	"elevation_deg" double precision,
	"air_temp_c" double precision,
	"station_pressure_pa" double precision,
	"relative_humidity_pct" double precision,
	"tape_range_m" double precision,
	"notes" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "test_series" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"test_date" date NOT NULL,
	"site" text,
	"notes" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "launchers" ADD CONSTRAINT "launchers_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "projectiles" ADD CONSTRAINT "projectiles_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_series_id_test_series_id_fk" FOREIGN KEY ("series_id") REFERENCES "public"."test_series"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_launcher_id_launchers_id_fk" FOREIGN KEY ("launcher_id") REFERENCES "public"."launchers"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_projectile_id_projectiles_id_fk" FOREIGN KEY ("projectile_id") REFERENCES "public"."projectiles"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_series" ADD CONSTRAINT "test_series_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_series" ADD CONSTRAINT "test_series_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "launchers_team_idx" ON "launchers" USING btree ("team_id");--> statement-breakpoint
CREATE INDEX "projectiles_team_idx" ON "projectiles" USING btree ("team_id");--> statement-breakpoint
CREATE INDEX "shots_team_idx" ON "shots" USING btree ("team_id","created_at");--> statement-breakpoint
CREATE INDEX "shots_series_idx" ON "shots" USING btree ("series_id");--> statement-breakpoint
CREATE INDEX "test_series_team_idx" ON "test_series" USING btree ("team_id","test_date");