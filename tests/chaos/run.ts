export async function runChaos(_args: string[]): Promise<number> {
  return 1;
}
