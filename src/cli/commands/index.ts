/**
 * Every command of the CLI, in the order the top-level help lists them. A new command is
 * a file in this folder exporting a Command, added here.
 */
import type { Command } from '../command.ts';
import { solveCommand } from './solve.ts';
import { mapCommand } from './map.ts';
import { mergeCommand } from './merge.ts';
import { edCommand } from './ed.ts';
import { vmcCommand } from './vmc.ts';
import { qmcCommand } from './qmc.ts';
import { qmcScanCommand } from './qmc-scan.ts';
import { staircaseCommand } from './staircase.ts';
import { spectrumCommand } from './spectrum.ts';
import { softlinesCommand } from './softlines.ts';

export const COMMANDS: readonly Command[] = [solveCommand, mapCommand, staircaseCommand, spectrumCommand, softlinesCommand, edCommand, vmcCommand, qmcCommand, qmcScanCommand, mergeCommand];
