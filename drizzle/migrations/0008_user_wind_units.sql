CREATE TYPE "public"."wind_units" AS ENUM('mps', 'kmh', 'mph');--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "wind_units" "wind_units" DEFAULT 'mps' NOT NULL;