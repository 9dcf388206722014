/** Which body of rules a site works under: picks regulation references and pass criteria. */
import { z } from 'zod';

export const JURISDICTIONS = ['uk', 'us'] as const;
export const JurisdictionSchema = z.enum(JURISDICTIONS);
export type Jurisdiction = z.infer<typeof JurisdictionSchema>;
