export async function nominalCommand(_args: string[]): Promise<number> {
  process.stderr.write('sigmatail nominal: not built yet\n');
  return 2;
}
