/**
 * The connection moments at the FORM design point: the most likely failing combination of load,
 * stiffness and bow, so the moments a joint must carry when the column is at its limit.
 */
import { connectionResponseAt, type ConnectionResponse } from '../limitState/connectionResponse.js';
import type { Assessment } from './columnAssessment.js';

/** null when FORM did not run. */
export function designPointConnections(a: Assessment): ConnectionResponse | null {
  if (!a.methods.includes('form') || a.form.designPointX.length !== a.model.names.length) return null;
  return connectionResponseAt(a.model, Float64Array.from(a.form.designPointX));
}
