/** Evidence that cannot update a distribution (message only; the caller adds the field's path). */
export class EvidenceError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EvidenceError';
  }
}
