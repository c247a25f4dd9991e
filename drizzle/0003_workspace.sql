CREATE TABLE "library_pane" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"name" text NOT NULL,
	"revision" integer DEFAULT 1 NOT NULL,
	"created_by_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "library_pane_revision" (
	"id" text PRIMARY KEY NOT NULL,
	"pane_id" text NOT NULL,
	"revision" integer NOT NULL,
	"name" text NOT NULL,
	"layer" jsonb NOT NULL,
	"note" text,
	"created_by_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "library_pane_revision_unique" UNIQUE("pane_id","revision")
);
--> statement-breakpoint
CREATE TABLE "makeup" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"name" text NOT NULL,
	"revision" integer DEFAULT 1 NOT NULL,
	"created_by_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "makeup_revision" (
	"id" text PRIMARY KEY NOT NULL,
	"makeup_id" text NOT NULL,
	"revision" integer NOT NULL,
	"name" text NOT NULL,
	"description" text NOT NULL,
	"layers" jsonb NOT NULL,
	"note" text,
	"values" jsonb NOT NULL,
	"created_by_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "makeup_revision_unique" UNIQUE("makeup_id","revision")
);
--> statement-breakpoint
CREATE TABLE "facade_option" (
	"id" text PRIMARY KEY NOT NULL,
	"project_id" text NOT NULL,
	"facade_id" text NOT NULL,
	"makeup_id" text NOT NULL,
	"makeup_revision_id" text NOT NULL,
	"name" text NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	"status" text DEFAULT 'proposed' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "facade_option_status" CHECK ("facade_option"."status" in ('proposed', 'approved', 'rejected'))
);
--> statement-breakpoint
CREATE TABLE "option_comment" (
	"id" text PRIMARY KEY NOT NULL,
	"option_id" text NOT NULL,
	"parent_id" text,
	"author_id" text,
	"author_name" text NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "option_decision" (
	"id" text PRIMARY KEY NOT NULL,
	"option_id" text NOT NULL,
	"decision" text NOT NULL,
	"note" text,
	"decided_by_id" text,
	"decided_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "project_event" (
	"id" text PRIMARY KEY NOT NULL,
	"project_id" text NOT NULL,
	"actor_id" text,
	"actor_name" text NOT NULL,
	"kind" text NOT NULL,
	"summary" text NOT NULL,
	"detail" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "project_requirements" (
	"project_id" text PRIMARY KEY NOT NULL,
	"limits" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by_id" text,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "result_cache" (
	"key" text PRIMARY KEY NOT NULL,
	"project_id" text NOT NULL,
	"value" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "schedule_revision" (
	"id" text PRIMARY KEY NOT NULL,
	"project_id" text NOT NULL,
	"sequence" integer NOT NULL,
	"letter" text NOT NULL,
	"note" text,
	"issued_by_id" text,
	"issued_by_name" text NOT NULL,
	"issued_at" timestamp with time zone DEFAULT now() NOT NULL,
	"snapshot" jsonb NOT NULL,
	CONSTRAINT "schedule_revision_sequence" UNIQUE("project_id","sequence"),
	CONSTRAINT "schedule_revision_letter" UNIQUE("project_id","letter")
);
--> statement-breakpoint
ALTER TABLE "facade" ADD COLUMN "glazed_area_m2" double precision;--> statement-breakpoint
ALTER TABLE "facade" ADD COLUMN "window_width_m" double precision;--> statement-breakpoint
ALTER TABLE "facade" ADD COLUMN "window_height_m" double precision;--> statement-breakpoint
ALTER TABLE "facade" ADD COLUMN "shading" jsonb;--> statement-breakpoint
ALTER TABLE "project" ADD COLUMN "ground_albedo" double precision DEFAULT 0.2 NOT NULL;--> statement-breakpoint
ALTER TABLE "project" ADD COLUMN "sky_model" text DEFAULT 'perez' NOT NULL;--> statement-breakpoint
ALTER TABLE "project" ADD COLUMN "linke_turbidity" jsonb;--> statement-breakpoint
ALTER TABLE "library_pane" ADD CONSTRAINT "library_pane_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_pane" ADD CONSTRAINT "library_pane_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_pane_revision" ADD CONSTRAINT "library_pane_revision_pane_id_library_pane_id_fk" FOREIGN KEY ("pane_id") REFERENCES "public"."library_pane"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_pane_revision" ADD CONSTRAINT "library_pane_revision_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "makeup" ADD CONSTRAINT "makeup_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "makeup" ADD CONSTRAINT "makeup_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "makeup_revision" ADD CONSTRAINT "makeup_revision_makeup_id_makeup_id_fk" FOREIGN KEY ("makeup_id") REFERENCES "public"."makeup"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "makeup_revision" ADD CONSTRAINT "makeup_revision_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "facade_option" ADD CONSTRAINT "facade_option_project_id_project_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."project"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "facade_option" ADD CONSTRAINT "facade_option_facade_id_facade_id_fk" FOREIGN KEY ("facade_id") REFERENCES "public"."facade"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "facade_option" ADD CONSTRAINT "facade_option_makeup_id_makeup_id_fk" FOREIGN KEY ("makeup_id") REFERENCES "public"."makeup"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "facade_option" ADD CONSTRAINT "facade_option_makeup_revision_id_makeup_revision_id_fk" FOREIGN KEY ("makeup_revision_id") REFERENCES "public"."makeup_revision"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "facade_option" ADD CONSTRAINT "facade_option_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "option_comment" ADD CONSTRAINT "option_comment_option_id_facade_option_id_fk" FOREIGN KEY ("option_id") REFERENCES "public"."facade_option"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "option_comment" ADD CONSTRAINT "option_comment_parent_id_option_comment_id_fk" FOREIGN KEY ("parent_id") REFERENCES "public"."option_comment"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "option_comment" ADD CONSTRAINT "option_comment_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "option_decision" ADD CONSTRAINT "option_decision_option_id_facade_option_id_fk" FOREIGN KEY ("option_id") REFERENCES "public"."facade_option"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "option_decision" ADD CONSTRAINT "option_decision_decided_by_id_user_id_fk" FOREIGN KEY ("decided_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_event" ADD CONSTRAINT "project_event_project_id_project_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."project"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_event" ADD CONSTRAINT "project_event_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_requirements" ADD CONSTRAINT "project_requirements_project_id_project_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."project"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_requirements" ADD CONSTRAINT "project_requirements_updated_by_id_user_id_fk" FOREIGN KEY ("updated_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "result_cache" ADD CONSTRAINT "result_cache_project_id_project_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."project"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_revision" ADD CONSTRAINT "schedule_revision_project_id_project_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."project"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "schedule_revision" ADD CONSTRAINT "schedule_revision_issued_by_id_user_id_fk" FOREIGN KEY ("issued_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "library_pane_organization_idx" ON "library_pane" USING btree ("organization_id","name");--> statement-breakpoint
CREATE INDEX "makeup_organization_idx" ON "makeup" USING btree ("organization_id","name");--> statement-breakpoint
CREATE INDEX "facade_option_project_idx" ON "facade_option" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "facade_option_facade_idx" ON "facade_option" USING btree ("facade_id","position");--> statement-breakpoint
CREATE INDEX "facade_option_makeup_idx" ON "facade_option" USING btree ("makeup_id");--> statement-breakpoint
CREATE UNIQUE INDEX "facade_option_one_approved" ON "facade_option" USING btree ("facade_id") WHERE "facade_option"."status" = 'approved';--> statement-breakpoint
CREATE INDEX "option_comment_option_idx" ON "option_comment" USING btree ("option_id","created_at");--> statement-breakpoint
CREATE INDEX "option_decision_option_idx" ON "option_decision" USING btree ("option_id","created_at");--> statement-breakpoint
CREATE INDEX "project_event_project_idx" ON "project_event" USING btree ("project_id","created_at" DESC NULLS LAST,"id");--> statement-breakpoint
CREATE INDEX "result_cache_project_idx" ON "result_cache" USING btree ("project_id");