CREATE TABLE "design_presets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"launcher_id" uuid NOT NULL,
	"projectile_id" uuid NOT NULL,
	"pressure_min_pa" double precision NOT NULL,
	"pressure_max_pa" double precision NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "design_presets_team_name_uq" UNIQUE("team_id","name")
);
--> statement-breakpoint
CREATE TABLE "fit_preset_comparisons" (
	"fit_id" uuid NOT NULL,
	"preset_version_id" uuid NOT NULL,
	"role" text NOT NULL,
	"compared_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "fit_preset_comparisons_fit_id_preset_version_id_pk" PRIMARY KEY("fit_id","preset_version_id")
);
--> statement-breakpoint
CREATE TABLE "preset_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"preset_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"drag_coefficient" double precision NOT NULL,
	"drag_coefficient_std" double precision NOT NULL,
	"efficiency" double precision NOT NULL,
	"efficiency_std" double precision NOT NULL,
	"launcher_model" text NOT NULL,
	"drag_source" text NOT NULL,
	"efficiency_source" text NOT NULL,
	"pooled_fit_ids" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"heterogeneity" jsonb,
	"keep_out_safety_factor" double precision NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"published_by" uuid,
	"published_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "preset_versions_preset_version_uq" UNIQUE("preset_id","version")
);
--> statement-breakpoint
ALTER TABLE "design_presets" ADD CONSTRAINT "design_presets_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_presets" ADD CONSTRAINT "design_presets_launcher_id_launchers_id_fk" FOREIGN KEY ("launcher_id") REFERENCES "public"."launchers"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_presets" ADD CONSTRAINT "design_presets_projectile_id_projectiles_id_fk" FOREIGN KEY ("projectile_id") REFERENCES "public"."projectiles"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_presets" ADD CONSTRAINT "design_presets_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_preset_comparisons" ADD CONSTRAINT "fit_preset_comparisons_fit_id_fits_id_fk" FOREIGN KEY ("fit_id") REFERENCES "public"."fits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_preset_comparisons" ADD CONSTRAINT "fit_preset_comparisons_preset_version_id_preset_versions_id_fk" FOREIGN KEY ("preset_version_id") REFERENCES "public"."preset_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "preset_versions" ADD CONSTRAINT "preset_versions_preset_id_design_presets_id_fk" FOREIGN KEY ("preset_id") REFERENCES "public"."design_presets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "preset_versions" ADD CONSTRAINT "preset_versions_published_by_users_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "design_presets_team_idx" ON "design_presets" USING btree ("team_id");--> statement-breakpoint
CREATE INDEX "fit_preset_comparisons_version_idx" ON "fit_preset_comparisons" USING btree ("preset_version_id");