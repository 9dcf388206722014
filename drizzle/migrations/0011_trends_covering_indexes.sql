DROP INDEX "findings_org_created_idx";--> statement-breakpoint
DROP INDEX "verifications_org_verified_idx";--> statement-breakpoint
CREATE INDEX "findings_trends_idx" ON "findings" USING btree ("organisation_id","created_at","risk_band","scaffold_id","lift","bay","elevation","id");--> statement-breakpoint
CREATE INDEX "verifications_trends_idx" ON "verifications" USING btree ("organisation_id","verified_at","outcome","finding_id");