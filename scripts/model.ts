/**
 * npm run model -- fcc|chain|diatomic|cubic2|layer|fcc-mesh --out FILE [--format columns|yaml]
 *   [--units THz|cm-1|meV] [--points N] [--defect soft-mode|sum-rule|shift|beyond-zone|noise-pocket] [--polar]
 * Writes a model spectrum (invented materials). Exit 0 on success, 2 on bad arguments or a write failure.
 */
import { renameSync, rmSync, writeFileSync } from 'node:fs';
import { buildModelSpectrum, MODEL_USAGE, ModelUsageError, parseModelArgs } from '../lib/models/cli';
import { writeColumns, writeYaml } from '../lib/writers';

function main(argv: string[]): number {
  let args;
  try {
    args = parseModelArgs(argv);
  } catch (e) {
    if (!(e instanceof ModelUsageError)) throw e;
    process.stderr.write(`model: ${e.message}\n\n${MODEL_USAGE}\n`);
    return 2;
  }
  if (args.help) {
    process.stdout.write(`${MODEL_USAGE}\n`);
    return 0;
  }
  const d = buildModelSpectrum(args);
  const text = args.format === 'yaml' ? writeYaml(d, { units: args.units }) : writeColumns(d, { units: args.units });
  // Write beside the target and rename, so a failure never leaves half a file under the real name.
  const tmp = `${args.out}.${process.pid}.tmp`;
  try {
    writeFileSync(tmp, text);
    renameSync(tmp, args.out);
  } catch (e) {
    rmSync(tmp, { force: true });
    process.stderr.write(`model: cannot write ${args.out}: ${(e as Error).message}\n`);
    return 2;
  }
  process.stdout.write(`model: wrote ${args.out} (${d.title}; ${d.nq} q-points × ${d.nb} branches, ${args.format}, ${args.units}${args.defect ? `, defect ${args.defect}` : ''})\n`);
  return 0;
}

process.exitCode = main(process.argv.slice(2));
