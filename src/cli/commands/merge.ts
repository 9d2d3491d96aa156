/**
 * `merge`: join the outputs of `map --shard k/n` (k = 1..n) into the file one unsharded
 * run would have written, streaming (merge-stream.ts: one buffered chunk a part in
 * memory); refuses a missing, repeated, incomplete or foreign part, and a row holding NaN,
 * text where a number belongs or cut short, naming the part and the line.
 */
import { InputError } from '../../core/input-error.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { textLineReader } from '../line-reader.ts';
import { mergeParts } from '../merge-stream.ts';
import { OUT_FLAG, streamOutput } from './output.ts';

export const mergeCommand: Command = {
  name: 'merge',
  summary: 'join the parts of a sharded map into one file',
  usage: 'merge part-1.csv part-2.csv ... [--out file]',
  description:
    'Reads the outputs of map --shard k/n for k = 1..n (CSV or JSON, all in one format), checks that\n' +
    'every part is present once, complete and from the same scan, and that every row holds numbers\n' +
    'where numbers belong (no NaN, no text, no row cut short), and writes the joined map in point\n' +
    'order (CSV without the shard line, or JSON) as it reads, to stdout or --out.',
  flags: [OUT_FLAG, HELP_FLAG],
  positional: true,
  examples: ['merge part-*.csv --out map.csv'],
  async run(args, io) {
    if (args.positional.length === 0) throw new InputError('merge needs the shard files to join', 'merge');
    const inputs = args.positional.map((source) => ({
      source,
      open: () => (io.openLines ? io.openLines(source) : textLineReader(io.readText(source))),
    }));
    return streamOutput(io, args, async (target) => {
      const { rows } = await mergeParts(inputs, target);
      return { complete: true, written: rows, total: rows };
    });
  },
};
