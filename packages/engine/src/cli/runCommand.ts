export async function runCommand(_args: string[]): Promise<number> {
  process.stderr.write('sigmatail run: not built yet\n');
  return 2;
}
