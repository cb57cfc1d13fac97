/**
 * Epsigma command line: `npm run -s cli -- <command> [flags] --json`.
 * Each command lives in scripts/cli/<command>.ts and exports `run(argv)`, which returns a JSON-able object.
 * JSON goes to stdout; errors go to stderr with exit code 1 (2 for an unknown command).
 */
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const commandsDir = fileURLToPath(new URL('./cli/', import.meta.url));

function availableCommands(): string[] {
  return readdirSync(commandsDir)
    .filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts') && !f.startsWith('_'))
    .map((f) => f.replace(/\.ts$/, ''))
    .sort();
}

/** Examples from the invented demo scenario (fixtures/demo/scenario.ts): quillgas QG-1 of Quillmoor Chemicals. */
const HELP_EXAMPLES = `examples (quillgas QG-1 of the demo scenario: ε/k_B = 131.5 K, σ = 3.524 Å, M = 44.62 g/mol):
  npm run -s cli -- b2 --epsilon-k 131.5 --sigma-angstrom 3.524 --temperatures 150,250,400 --json
  npm run -s cli -- viscosity --epsilon-k 131.5 --sigma-angstrom 3.524 --molar-mass 44.62 --temperatures 300,500 --json
  npm run -s cli -- fit --data fixtures/demo/quillgas-qg1-b2.csv --data fixtures/demo/quillgas-qg1-viscosity.csv --molar-mass 44.62 --json
`;

async function main(): Promise<number> {
  const [command, ...rest] = process.argv.slice(2);
  const commands = availableCommands();
  if (!command || command === '--help' || command === 'help') {
    process.stderr.write(`usage: npm run -s cli -- <command> [flags] --json\ncommands: ${commands.join(', ')}\n${HELP_EXAMPLES}`);
    return command ? 0 : 2;
  }
  if (!commands.includes(command)) {
    process.stderr.write(`epsigma: unknown command "${command}"; expected one of: ${commands.join(', ')}\n`);
    return 2;
  }
  const mod = (await import(`./cli/${command}.ts`)) as { run: (argv: string[]) => Promise<unknown> | unknown; HELP?: string };
  // A command that exports HELP answers `<command> --help` with it (plain text on stdout).
  if (mod.HELP && rest.includes('--help')) {
    process.stdout.write(mod.HELP);
    return 0;
  }
  // Output is always JSON; `--json` is accepted so scripts can state what they expect.
  const output = await mod.run(rest.filter((a) => a !== '--json'));
  process.stdout.write(`${JSON.stringify(output, null, 2)}\n`);
  return 0;
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    process.stderr.write(`epsigma: ${err instanceof Error ? err.message : String(err)}\n`);
    process.exit(1);
  },
);
