/** Placeholder: descriptive diagnostics of one sample. */
import type { SampleDiagnostics } from './types.js';

export function describeSample(_label: string, _values: number[]): SampleDiagnostics {
  throw new Error('diagnostics are not built yet');
}
