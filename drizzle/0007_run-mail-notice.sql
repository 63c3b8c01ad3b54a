CREATE TABLE "run_mail_notice" (
	"run_kind" text NOT NULL,
	"run_id" uuid NOT NULL,
	"status" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "run_mail_notice_run_kind_run_id_pk" PRIMARY KEY("run_kind","run_id")
);
