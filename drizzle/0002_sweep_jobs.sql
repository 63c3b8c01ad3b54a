CREATE TYPE "public"."sweep_chunk_status" AS ENUM('pending', 'done', 'failed');--> statement-breakpoint
ALTER TYPE "public"."sweep_status" ADD VALUE 'cancelled';--> statement-breakpoint
CREATE TABLE "sweep_chunk" (
	"sweep_id" uuid NOT NULL,
	"chunk" integer NOT NULL,
	"start" integer NOT NULL,
	"end" integer NOT NULL,
	"status" "sweep_chunk_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"error" text,
	"worker_id" text,
	"finished_at" timestamp with time zone,
	CONSTRAINT "sweep_chunk_sweep_id_chunk_pk" PRIMARY KEY("sweep_id","chunk")
);
--> statement-breakpoint
CREATE TABLE "worker" (
	"id" text PRIMARY KEY NOT NULL,
	"host" text NOT NULL,
	"pid" integer NOT NULL,
	"threads" integer NOT NULL,
	"started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"heartbeat_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "candidate" ADD COLUMN "variant_scores" double precision[];--> statement-breakpoint
ALTER TABLE "sweep_chunk" ADD CONSTRAINT "sweep_chunk_sweep_id_sweep_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweep"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sweep_chunk_finished_idx" ON "sweep_chunk" USING btree ("sweep_id","finished_at");