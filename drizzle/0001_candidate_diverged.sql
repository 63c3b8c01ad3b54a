ALTER TYPE "public"."candidate_status" ADD VALUE 'diverged';--> statement-breakpoint
ALTER TABLE "candidate" ADD COLUMN "error" text;