CREATE TYPE "public"."decision_event_kind" AS ENUM('proposed', 'revised', 'returned', 'commented', 'approved', 'superseded', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."decision_state" AS ENUM('proposed', 'returned', 'approved', 'superseded', 'withdrawn');--> statement-breakpoint
CREATE TABLE "decision" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"title" text NOT NULL,
	"rationale" text NOT NULL,
	"state" "decision_state" DEFAULT 'proposed' NOT NULL,
	"source" jsonb NOT NULL,
	"content" jsonb NOT NULL,
	"family_key" text NOT NULL,
	"sweep_id" uuid,
	"comparison_id" uuid,
	"proposed_by" text NOT NULL,
	"proposed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"approved_by" text,
	"approved_at" timestamp with time zone,
	"supersedes" uuid,
	"superseded_by" uuid,
	"superseded_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "decision_event" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "decision_event_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"decision_id" uuid NOT NULL,
	"kind" "decision_event_kind" NOT NULL,
	"actor_id" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"from_state" "decision_state",
	"to_state" "decision_state",
	"comment" text,
	"details" jsonb
);
--> statement-breakpoint
CREATE TABLE "decision_revision" (
	"decision_id" uuid NOT NULL,
	"plant_revision_id" uuid NOT NULL,
	CONSTRAINT "decision_revision_decision_id_plant_revision_id_pk" PRIMARY KEY("decision_id","plant_revision_id")
);
--> statement-breakpoint
CREATE TABLE "decision_setting" (
	"workspace_id" uuid PRIMARY KEY NOT NULL,
	"allow_self_approval" boolean DEFAULT false NOT NULL,
	"updated_by" text,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "notification_setting" (
	"user_id" text NOT NULL,
	"kind" text NOT NULL,
	"enabled" boolean NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "notification_setting_user_id_kind_pk" PRIMARY KEY("user_id","kind")
);
--> statement-breakpoint
ALTER TABLE "decision" ADD CONSTRAINT "decision_workspace_id_workspace_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspace"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision" ADD CONSTRAINT "decision_sweep_id_sweep_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweep"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision" ADD CONSTRAINT "decision_comparison_id_comparison_id_fk" FOREIGN KEY ("comparison_id") REFERENCES "public"."comparison"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision" ADD CONSTRAINT "decision_proposed_by_user_id_fk" FOREIGN KEY ("proposed_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision" ADD CONSTRAINT "decision_approved_by_user_id_fk" FOREIGN KEY ("approved_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_event" ADD CONSTRAINT "decision_event_decision_id_decision_id_fk" FOREIGN KEY ("decision_id") REFERENCES "public"."decision"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_event" ADD CONSTRAINT "decision_event_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_revision" ADD CONSTRAINT "decision_revision_decision_id_decision_id_fk" FOREIGN KEY ("decision_id") REFERENCES "public"."decision"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_revision" ADD CONSTRAINT "decision_revision_plant_revision_id_plant_revision_id_fk" FOREIGN KEY ("plant_revision_id") REFERENCES "public"."plant_revision"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_setting" ADD CONSTRAINT "decision_setting_workspace_id_workspace_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspace"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "decision_setting" ADD CONSTRAINT "decision_setting_updated_by_user_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notification_setting" ADD CONSTRAINT "notification_setting_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "decision_workspace_updated_idx" ON "decision" USING btree ("workspace_id","updated_at");--> statement-breakpoint
CREATE INDEX "decision_family_idx" ON "decision" USING btree ("workspace_id","family_key","state");--> statement-breakpoint
CREATE UNIQUE INDEX "decision_one_approved_per_family" ON "decision" USING btree ("workspace_id","family_key") WHERE "decision"."state" = 'approved';--> statement-breakpoint
CREATE INDEX "decision_event_decision_idx" ON "decision_event" USING btree ("decision_id","id");--> statement-breakpoint
CREATE INDEX "decision_revision_revision_idx" ON "decision_revision" USING btree ("plant_revision_id");