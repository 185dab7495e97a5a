/** The launcher's own lines are prefixed so they stand out among Next's and PostgreSQL's output. */
export function log(message: string): void {
  console.log(`[shuntbook] ${message}`);
}
