/**
 * The wizard's form: a title and notes around the engine's brief schema, and
 * which fields each step owns (for per-step validation).
 */
import { z } from 'zod/mini';
import { railSpecSchema } from '../engine/rail-spec';

export const wizardFormSchema = z.object({
  title: z
    .string()
    .check(
      z.trim(),
      z.minLength(1, { error: 'Give the rail a short name, e.g. “Sensor board 3.3 V”.' }),
      z.maxLength(160, { error: 'Keep the name under 160 characters.' }),
    ),
  notes: z.string().check(z.maxLength(8_000, { error: 'Keep the notes under 8 000 characters.' })),
  spec: railSpecSchema,
});

export type WizardInput = z.input<typeof wizardFormSchema>;
export type WizardOutput = z.output<typeof wizardFormSchema>;

export const WIZARD_STEPS = [
  {
    id: 'source',
    title: 'Source',
    fields: ['spec.input.source', 'spec.input.vMin', 'spec.input.vNom', 'spec.input.vMax', 'spec.input.rippleVpp'],
  },
  { id: 'rail', title: 'Rail', fields: ['title', 'spec.output.v', 'spec.output.tolerance'] },
  {
    id: 'load',
    title: 'Load',
    fields: ['spec.output.iMin', 'spec.output.iTyp', 'spec.output.iMax', 'spec.output.loadStep', 'spec.output.maxStepDeviation'],
  },
  { id: 'quietness', title: 'Quietness', fields: ['spec.noise.class', 'spec.noise.maxRippleVpp'] },
  { id: 'surroundings', title: 'Surroundings', fields: ['spec.thermal.ambientMaxC', 'spec.thermal.airflow'] },
  { id: 'files', title: 'Files and notes', fields: ['notes'] },
  { id: 'review', title: 'Review', fields: [] },
] as const;

export type WizardStepId = (typeof WIZARD_STEPS)[number]['id'];
export type WizardField = (typeof WIZARD_STEPS)[number]['fields'][number];
