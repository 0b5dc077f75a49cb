/** `--name value` from the command line as a number, or the fallback. Shared by the bench scripts. */
export function argument(name: string, fallback: number): number {
  const i = process.argv.indexOf(name);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}
