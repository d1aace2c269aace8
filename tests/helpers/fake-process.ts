// A mail or storage fake of a test's own, as its own process (as the stack runs it), for tests
// that stop it the hard way to see what the app does while it is gone.
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { waitForPort } from '../../scripts/lib/system';
import { checkoutRoot } from './instance';

/** Starts fakes/<name>.ts with `env` and resolves once `port` answers. */
export async function startFakeProcess(name: 'mail' | 'storage', port: number, env: NodeJS.ProcessEnv): Promise<ChildProcess> {
	const proc = spawn(process.execPath, ['--import', 'tsx', join(checkoutRoot, 'fakes', `${name}.ts`)], {
		cwd: checkoutRoot,
		env: { ...process.env, ...env },
		stdio: 'ignore'
	});
	if (!(await waitForPort(port, 30_000))) {
		proc.kill('SIGKILL');
		throw new Error(`The ${name} fake did not start on port ${port}.`);
	}
	return proc;
}

/** Stops it the hard way (SIGKILL): the service is simply gone, connections and all. */
export async function killHard(proc: ChildProcess | null): Promise<void> {
	if (!proc || proc.exitCode !== null || proc.signalCode !== null) return;
	const gone = new Promise((resolve) => proc.once('exit', resolve));
	proc.kill('SIGKILL');
	await gone;
}
