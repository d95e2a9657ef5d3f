import type { Command } from '../command.js';
import { command as demo } from './demo.js';
import { command as kerr } from './kerr.js';
import { command as greybody } from './greybody.js';
import { command as crossSection } from './crossSection.js';
import { command as table } from './table.js';
import { command as merge } from './merge.js';
import { command as plot } from './plot.js';
import { command as spheroidal } from './spheroidal.js';
import { command as emission } from './emission.js';
import { command as evolve } from './evolve.js';

/** Every command of the penumbra executable, in the order `penumbra --help` lists them. */
export const commands: Command[] = [demo, kerr, greybody, crossSection, table, merge, plot, spheroidal, emission, evolve];
