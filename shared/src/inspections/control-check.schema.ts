/** Control checks: one falling-object control ticked during an inspection. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, NoteSchema } from '../common/fields.schema.js';

export const CONTROLS = [
  'toe-boards',
  'brick-guards',
  'netting-or-sheeting',
  'fans-or-canopies',
  'exclusion-zone-barriers',
  'tool-tethering',
  'material-storage',
  // Added with the register: what an inspector also looks at for objects falling.
  'chutes-and-lowering',
  'loading-bay-gates',
  'guardrail-mesh',
] as const;
export const ControlSchema = z.enum(CONTROLS);
export type Control = z.infer<typeof ControlSchema>;

/** Each control in the trade's words: the phone's check cards, the report and the e-mail. */
export const CONTROL_LABELS: Readonly<Record<Control, string>> = {
  'toe-boards': 'Toe boards',
  'brick-guards': 'Brick guards',
  'netting-or-sheeting': 'Netting or sheeting',
  'fans-or-canopies': 'Fans or canopies',
  'exclusion-zone-barriers': 'Exclusion-zone barriers',
  'tool-tethering': 'Tool tethering',
  'material-storage': 'Material storage',
  'chutes-and-lowering': 'Rubbish chutes and lowering',
  'loading-bay-gates': 'Loading-bay gates',
  'guardrail-mesh': 'Guard-rail mesh or screening',
};

export const CONTROL_RESULTS = ['pass', 'fail', 'not-applicable'] as const;
export const ControlResultSchema = z.enum(CONTROL_RESULTS);
export type ControlResult = z.infer<typeof ControlResultSchema>;

export const ControlCheckSchema = z.object({
  id: IdSchema,
  inspectionId: IdSchema,
  control: ControlSchema,
  result: ControlResultSchema,
  note: z.string(),
  createdAt: DateTimeSchema,
  updatedAt: DateTimeSchema,
  version: z.number().int(),
});
export type ControlCheck = z.infer<typeof ControlCheckSchema>;

/** Body of PUT /inspections/:id/control-checks/:control (the control is in the path). */
export const ControlCheckPutSchema = z.object({
  result: ControlResultSchema,
  note: NoteSchema.default(''),
});
export type ControlCheckPut = z.infer<typeof ControlCheckPutSchema>;
