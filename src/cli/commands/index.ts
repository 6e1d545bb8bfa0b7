/** The command table. Adding a command is one line here. */
import type { Command } from '../command.js';
import { compareCommand } from './compare.js';
import { describeCommand } from './describe.js';
import { auditCommand } from './audit.js';
import { mergeShardsCommand } from './bulk-audit.js';

export const commands: Command[] = [describeCommand, compareCommand, auditCommand, mergeShardsCommand];
