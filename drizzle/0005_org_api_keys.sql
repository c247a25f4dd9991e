CREATE TABLE "org_api_key" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"name" text NOT NULL,
	"scope" text NOT NULL,
	"key_hash" text NOT NULL,
	"start" text NOT NULL,
	"created_by_id" text,
	"created_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_used_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	CONSTRAINT "org_api_key_key_hash_unique" UNIQUE("key_hash"),
	CONSTRAINT "org_api_key_scope_check" CHECK ("org_api_key"."scope" in ('read', 'calculate', 'read-write'))
);
--> statement-breakpoint
CREATE TABLE "organization_event" (
	"id" text PRIMARY KEY NOT NULL,
	"organization_id" text NOT NULL,
	"actor_id" text,
	"actor_name" text NOT NULL,
	"kind" text NOT NULL,
	"summary" text NOT NULL,
	"detail" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "org_api_key" ADD CONSTRAINT "org_api_key_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "org_api_key" ADD CONSTRAINT "org_api_key_created_by_id_user_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "organization_event" ADD CONSTRAINT "organization_event_organization_id_organization_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "organization_event" ADD CONSTRAINT "organization_event_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "org_api_key_org_idx" ON "org_api_key" USING btree ("organization_id","created_at" DESC NULLS LAST,"id");--> statement-breakpoint
CREATE INDEX "organization_event_org_idx" ON "organization_event" USING btree ("organization_id","created_at" DESC NULLS LAST,"id");