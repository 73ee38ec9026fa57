import type { Control } from 'react-hook-form';
import type { z } from 'zod';
import type { Distribution, InputQuantity, quantitySchema } from '../../../../shared/budget/schema';

/** The form's values as the budget schema reads them (any field may be missing or NaN while typed). */
export type InputFormValues = z.input<typeof quantitySchema>;

/* eslint-disable @typescript-eslint/no-explicit-any */
/** A distribution while it is typed: any of its kind's fields may be missing. */
export type DraftDistribution = Distribution & Record<string, any>;

/**
 * What every part of the input form shares: the input as the page holds it
 * (the source of every shown value, so typing recomputes at once), the
 * react-hook-form control that validates it with the budget schema, and how a
 * change reaches the page.
 */
export interface InputDraft {
  input: InputQuantity;
  distribution: DraftDistribution;
  control: Control<InputFormValues, unknown, InputQuantity>;
  /** Sets distribution fields; a field set to undefined is removed. */
  setDistribution(patch: Record<string, unknown>): void;
  /** The message of a field (`distribution.u`, `symbol`): the budget schema's, else the live recompute's. */
  errorAt(field: string): string | null;
  readOnly: boolean;
  /** The value's unit as shown, '' when none. */
  unit: string;
  /** The uncertainty fields' unit as shown: `uncertaintyUnit`, else the value's. */
  uncertaintyUnit: string;
}
