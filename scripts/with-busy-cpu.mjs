#!/usr/bin/env node
/**
 * Runs a command on a busy machine: starts two CPU-bound processes, runs the
 * command (default: the test suite, `npx vitest run`), stops the two, and
 * exits with the command's status. The suite must pass like this: a test
 * that depends on the machine's speed fails here.
 *
 *   node scripts/with-busy-cpu.mjs [--burners N] [command args...]
 *
 * The burners are bounded: each stops when this script ends (it checks its
 * parent every few million iterations) and after at most one hour.
 */
import { spawn } from 'node:child_process';

const args = process.argv.slice(2);
let burners = 2;
if (args[0] === '--burners') {
  burners = Number(args[1]);
  args.splice(0, 2);
  if (!Number.isInteger(burners) || burners < 0 || burners > 16) {
    process.stderr.write('with-busy-cpu: --burners takes a whole number from 0 to 16\n');
    process.exit(2);
  }
}
const command = args.length > 0 ? args : ['npx', 'vitest', 'run'];

// Spins until its parent is gone or an hour has passed: pure CPU, no memory growth.
const BURN = `
const parent = process.ppid;
const end = Date.now() + 3600e3;
let x = 0;
for (;;) {
  for (let i = 0; i < 5e6; i++) x = (x * 1103515245 + 12345) % 2147483648;
  if (process.ppid !== parent || Date.now() > end) process.exit(0);
}
`;

const children = [];
for (let i = 0; i < burners; i++) {
  children.push(spawn(process.execPath, ['-e', BURN], { stdio: 'ignore' }));
}
process.stderr.write(`with-busy-cpu: ${burners} CPU-bound processes running (pids ${children.map((c) => c.pid).join(', ')}); running: ${command.join(' ')}\n`);

const stopBurners = () => {
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
};
process.on('exit', stopBurners);
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    stopBurners();
    process.exit(130);
  });
}

const run = spawn(command[0], command.slice(1), { stdio: 'inherit' });
run.on('error', (error) => {
  process.stderr.write(`with-busy-cpu: could not run ${command[0]}: ${error.message}\n`);
  stopBurners();
  process.exit(2);
});
run.on('exit', (code, signal) => {
  stopBurners();
  process.exit(code ?? (signal ? 1 : 0));
});
