CREATE TYPE "public"."comparison_status" AS ENUM('queued', 'running', 'finished', 'failed', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."comparison_task_status" AS ENUM('pending', 'done', 'failed');--> statement-breakpoint
CREATE TABLE "comparison" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"name" text NOT NULL,
	"definition" jsonb NOT NULL,
	"status" "comparison_status" DEFAULT 'queued' NOT NULL,
	"prescan_total" integer NOT NULL,
	"contenders" integer NOT NULL,
	"result" jsonb,
	"error" text,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "comparison_chunk" (
	"comparison_id" uuid NOT NULL,
	"chunk" integer NOT NULL,
	"start" integer NOT NULL,
	"end" integer NOT NULL,
	"status" "comparison_task_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"data" jsonb,
	"error" text,
	"worker_id" text,
	"finished_at" timestamp with time zone,
	CONSTRAINT "comparison_chunk_comparison_id_chunk_pk" PRIMARY KEY("comparison_id","chunk")
);
--> statement-breakpoint
CREATE TABLE "comparison_pick" (
	"comparison_id" uuid NOT NULL,
	"contender" integer NOT NULL,
	"status" "comparison_task_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"data" jsonb,
	"error" text,
	"worker_id" text,
	"finished_at" timestamp with time zone,
	CONSTRAINT "comparison_pick_comparison_id_contender_pk" PRIMARY KEY("comparison_id","contender")
);
--> statement-breakpoint
ALTER TABLE "comparison" ADD CONSTRAINT "comparison_workspace_id_workspace_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspace"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison" ADD CONSTRAINT "comparison_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_chunk" ADD CONSTRAINT "comparison_chunk_comparison_id_comparison_id_fk" FOREIGN KEY ("comparison_id") REFERENCES "public"."comparison"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_pick" ADD CONSTRAINT "comparison_pick_comparison_id_comparison_id_fk" FOREIGN KEY ("comparison_id") REFERENCES "public"."comparison"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "comparison_workspace_created_idx" ON "comparison" USING btree ("workspace_id","created_at");--> statement-breakpoint
CREATE INDEX "comparison_unfinished_idx" ON "comparison" USING btree ("status") WHERE "comparison"."status" in ('queued', 'running');