-- Tag status as neutral codes; existing rows keep their meaning (renamed in place, not recast).
ALTER TYPE "public"."scaffold_status" RENAME VALUE 'Safe to use' TO 'cleared';--> statement-breakpoint
ALTER TYPE "public"."scaffold_status" RENAME VALUE 'Restricted use' TO 'limited';--> statement-breakpoint
ALTER TYPE "public"."scaffold_status" RENAME VALUE 'Do not use' TO 'closed';--> statement-breakpoint
ALTER TABLE "scaffolds" ALTER COLUMN "status" SET DEFAULT 'closed';
