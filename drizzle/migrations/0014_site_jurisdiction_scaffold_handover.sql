CREATE TYPE "public"."jurisdiction" AS ENUM('uk', 'us');--> statement-breakpoint
CREATE TYPE "public"."load_class" AS ENUM('class-1', 'class-2', 'class-3', 'class-4', 'class-5', 'class-6', 'light-duty', 'medium-duty', 'heavy-duty');--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "lift_heights_m" real[] DEFAULT '{}' NOT NULL;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "regime" "inspection_regime";--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "load_class" "load_class";--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "design_reference" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "erecting_contractor" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "scaffolds" ADD COLUMN "handed_over_on" date;--> statement-breakpoint
ALTER TABLE "sites" ADD COLUMN "jurisdiction" "jurisdiction" DEFAULT 'uk' NOT NULL;