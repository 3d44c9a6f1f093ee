/** A refusal of `npm run backup` or `npm run restore`, in words that say what is wrong and what to do. */
export class BackupError extends Error {
  constructor(message: string, options?: ErrorOptions) {
    super(message, options);
    this.name = 'BackupError';
  }
}
