/**
 * `merge`: join the outputs of `map --shard k/n` (k = 1..n) into the file one unsharded
 * run would have written; refuses a missing, repeated, incomplete or foreign part, naming it.
 */
import { InputError } from '../../core/input-error.ts';
import { mergeShards } from '../../core/scan/merge.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { readMapFile, type MapFile } from '../map-output.ts';
import { finishOutput, OUT_FLAG } from './output.ts';

export const mergeCommand: Command = {
  name: 'merge',
  summary: 'join the parts of a sharded map into one file',
  usage: 'merge part-1.csv part-2.csv ... [--out file]',
  description:
    'Reads the outputs of map --shard k/n for k = 1..n (CSV or JSON, all in one format), checks that\n' +
    'every part is present once, complete and from the same scan, and writes the joined map in\n' +
    'point order (CSV without the shard line, or JSON), to stdout or --out.',
  flags: [OUT_FLAG, HELP_FLAG],
  positional: true,
  examples: ['merge part-*.csv --out map.csv'],
  async run(args, io) {
    if (args.positional.length === 0) throw new InputError('merge needs the shard files to join', 'merge');
    const files: MapFile[] = args.positional.map((f) => readMapFile(io.readText(f), f));
    const format = files[0].format;
    const odd = files.find((f) => f.format !== format);
    if (odd) throw new InputError(`${odd.part.source} is ${odd.format}, ${files[0].part.source} is ${format}: merge parts of one format`, 'merge');
    let text: string;
    if (format === 'csv') {
      const csv = files as Extract<MapFile, { format: 'csv' }>[];
      const other = csv.find((f) => f.header !== csv[0].header);
      if (other) throw new InputError(`${other.part.source} has other columns than ${csv[0].part.source}`, 'merge');
      const rows = mergeShards(csv.map((f) => f.part));
      text = csv[0].header + '\n' + rows.map((r) => r + '\n').join('');
    } else {
      const js = files as Extract<MapFile, { format: 'json' }>[];
      const points = mergeShards(js.map((f) => f.part));
      text = JSON.stringify({ ...js[0].doc, shard: null, complete: true, points }) + '\n';
    }
    return finishOutput(io, args, text, { complete: true, points: [], total: 0 });
  },
};
