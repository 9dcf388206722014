CREATE INDEX "findings_overview_idx" ON "findings" USING btree ("organisation_id","state","scaffold_id","risk_band","due_at");--> statement-breakpoint
CREATE INDEX "findings_org_created_idx" ON "findings" USING btree ("organisation_id","created_at");--> statement-breakpoint
CREATE INDEX "findings_inspection_idx" ON "findings" USING btree ("inspection_id");--> statement-breakpoint
CREATE INDEX "fixes_org_finding_idx" ON "fixes" USING btree ("organisation_id","finding_id","fixed_at");--> statement-breakpoint
CREATE INDEX "verifications_org_verified_idx" ON "verifications" USING btree ("organisation_id","verified_at");