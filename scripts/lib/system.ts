// Facts about the machine and small process helpers: root, free disk, free ports, Debian packages.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, statfsSync, writeFileSync, rmSync } from 'node:fs';
import net from 'node:net';
import { Interrupted, SetupError, step } from './log';
import { shuttingDown, track } from './children';

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

export function which(binary: string, extraDirs: string[] = ['/usr/sbin', '/usr/bin', '/sbin']): string | null {
	const dirs = [...(process.env.PATH ?? '').split(':'), ...extraDirs].filter(Boolean);
	for (const dir of dirs) {
		const candidate = `${dir}/${binary}`;
		if (existsSync(candidate)) return candidate;
	}
	return null;
}

/** Fails early, with a clear message, when the disk that holds `path` is nearly full. */
export function requireFreeDisk(path: string, minimumMb: number): void {
	mkdirSync(path, { recursive: true });
	const stats = statfsSync(path);
	const freeMb = Math.floor((stats.bavail * stats.bsize) / 1024 / 1024);
	if (freeMb < minimumMb) {
		throw new SetupError(
			`Only ${freeMb} MB free on the disk that holds ${path}; Riparia needs at least ${minimumMb} MB there.`,
			'Free some disk space (old logs, caches, `npm cache clean --force`) and run the command again.'
		);
	}
}

export function portIsFree(port: number, host = '127.0.0.1'): Promise<boolean> {
	return new Promise((resolve) => {
		const server = net.createServer();
		server.once('error', () => resolve(false));
		server.listen(port, host, () => server.close(() => resolve(true)));
	});
}

export async function requireFreePort(port: number, what: string, envName: string): Promise<void> {
	if (!(await portIsFree(port))) {
		throw new SetupError(
			`Port ${port} on 127.0.0.1, wanted for ${what}, is already in use by another program.`,
			`Stop that program (\`ss -ltnp 'sport = :${port}'\` shows which one) or choose another port with ${envName}=<port>.`
		);
	}
}

export async function waitForPort(port: number, timeoutMs: number, host = '127.0.0.1'): Promise<boolean> {
	const deadline = Date.now() + timeoutMs;
	while (Date.now() < deadline) {
		const open = await new Promise<boolean>((resolve) => {
			const socket = net.connect(port, host);
			socket.once('connect', () => {
				socket.destroy();
				resolve(true);
			});
			socket.once('error', () => resolve(false));
		});
		if (open) return true;
		await new Promise((r) => setTimeout(r, 150));
	}
	return false;
}

/**
 * Installs Debian packages with apt-get, as root only. Services the packages bring are kept from
 * starting (policy-rc.d) so no system-wide MariaDB is left running beside ours.
 */
export function aptInstall(packages: string[], why: string): void {
	if (!isRoot()) {
		throw new SetupError(
			`${why} needs the Debian package(s) ${packages.join(', ')}, which are not installed, and this user is not root.`,
			`Install them once with: sudo apt-get install -y ${packages.join(' ')}\nthen run the command again.`
		);
	}
	step(`Installing ${packages.join(', ')} from Debian's packages (${why})…`);
	const policy = '/usr/sbin/policy-rc.d';
	const ownPolicy = !existsSync(policy);
	if (ownPolicy) writeFileSync(policy, '#!/bin/sh\nexit 101\n', { mode: 0o755 });
	try {
		const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
		const update = spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
		if (update.status !== 0) {
			throw new SetupError(
				'apt-get update failed, so the package lists could not be refreshed.',
				'Check the network connection to the Debian mirrors (/etc/apt/sources.list) and run the command again.'
			);
		}
		const install = spawnSync('apt-get', ['install', '-y', '-qq', ...packages], { stdio: 'inherit', env });
		if (install.status !== 0) {
			throw new SetupError(
				`apt-get install ${packages.join(' ')} failed (see above).`,
				'Fix the apt error shown above (network, disk space, a held package) and run the command again.'
			);
		}
	} finally {
		if (ownPolicy) rmSync(policy, { force: true });
	}
}

/**
 * Starts a long-running helper in its own process group, so Ctrl-C reaches us first and we stop it
 * in order. It is tracked (`children.ts`) from the moment it is spawned, so a shutdown at any step
 * or our own exit stops it too.
 */
export function spawnManaged(name: string, command: string, args: string[], options: { env?: NodeJS.ProcessEnv; cwd?: string; logFile?: number | 'inherit' }) {
	const stdio = options.logFile === undefined || options.logFile === 'inherit' ? 'inherit' : options.logFile;
	if (shuttingDown()) throw new Interrupted();
	const child = spawn(command, args, {
		cwd: options.cwd,
		env: options.env ?? process.env,
		detached: true,
		stdio: ['ignore', stdio, stdio]
	});
	let exited = false;
	const exitPromise = new Promise<number | null>((resolve) => {
		child.once('exit', (code) => {
			exited = true;
			resolve(code);
		});
		// A command that cannot be started at all (ENOENT) ends here, with no exit event.
		child.once('error', () => {
			exited = true;
			resolve(null);
		});
	});
	const stop = async (timeoutMs = 30_000) => {
		if (exited) return;
		child.kill('SIGTERM');
		const timer = setTimeout(() => {
			if (!exited) child.kill('SIGKILL');
		}, timeoutMs);
		await exitPromise;
		clearTimeout(timer);
	};
	const untrack = track({ name, stop: () => stop(), signal: () => void (!exited && child.kill('SIGTERM')) });
	void exitPromise.then(untrack);
	return { name, child, exited: () => exited, exitPromise, stop };
}
export type ManagedProcess = ReturnType<typeof spawnManaged>;
