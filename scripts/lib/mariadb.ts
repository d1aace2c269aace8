// A private MariaDB server for this checkout: its own data folder under .data/, its own socket,
// bound to 127.0.0.1 on its own port, so it never touches a system-wide MariaDB.
import { closeSync, existsSync, mkdirSync, openSync, readdirSync, readFileSync, renameSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import mysql from 'mysql2/promise';
import { Interrupted, SetupError, note, ok, step } from './log';
import { runStep, shuttingDown, track } from './children';
import { aptInstall, isRoot, requireFreeDisk, requireFreePort, spawnManaged, which, type ManagedProcess } from './system';

export interface MariaDbOptions {
	/** Folder for this instance: data/, run/ and the error log live inside it. */
	home: string;
	port: number;
	portEnvName: string;
}

export interface RunningMariaDb {
	socket: string;
	port: number;
	process: ManagedProcess | null;
	/** Runs statements as root over the private socket. */
	admin<T = unknown>(statements: string[]): Promise<T[]>;
	stop(): Promise<void>;
}

function findServer(): string | null {
	return which('mariadbd') ?? which('mysqld');
}

export function ensureMariaDbInstalled(): string {
	let server = findServer();
	if (!server) {
		aptInstall(['mariadb-server'], 'The database');
		server = findServer();
	}
	if (!server || !which('mariadb-install-db')) {
		throw new SetupError(
			'MariaDB is installed only partly: mariadbd or mariadb-install-db is missing.',
			'Reinstall it with: apt-get install --reinstall -y mariadb-server'
		);
	}
	return server;
}

function tailOf(file: string, lines = 25): string {
	if (!existsSync(file)) return '(no log written)';
	return readFileSync(file, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
}

async function canConnect(socket: string): Promise<boolean> {
	try {
		const conn = await mysql.createConnection({ socketPath: socket, user: 'root' });
		await conn.end();
		return true;
	} catch {
		return false;
	}
}

function processAlive(pidFile: string): number | null {
	if (!existsSync(pidFile)) return null;
	const pid = Number(readFileSync(pidFile, 'utf8').trim());
	if (!pid) return null;
	try {
		process.kill(pid, 0);
		return pid;
	} catch {
		return null;
	}
}

export async function startMariaDb(options: MariaDbOptions): Promise<RunningMariaDb> {
	const dataDir = join(options.home, 'data');
	const runDir = join(options.home, 'run');
	const socket = join(runDir, 'mariadb.sock');
	const pidFile = join(runDir, 'mariadb.pid');
	const errorLog = join(options.home, 'mariadb.err');
	// Its own folder for temporary tables: /tmp is shared with every other program on the machine.
	const tmpDir = join(options.home, 'tmp');
	mkdirSync(runDir, { recursive: true, mode: 0o700 });
	mkdirSync(tmpDir, { recursive: true, mode: 0o700 });
	requireFreeDisk(options.home, 600);

	const server = ensureMariaDbInstalled();
	const asRoot = isRoot() ? ['--user=root'] : [];

	if (!existsSync(join(dataDir, 'mysql'))) {
		step(`Initialising a MariaDB data folder in ${dataDir}…`);
		// Into a folder of its own, renamed into place only when complete: an initialisation cut
		// short (Ctrl-C) must not leave a half-made data folder that the next start takes as ready.
		const initDir = `${dataDir}.init`;
		rmSync(initDir, { recursive: true, force: true });
		if (existsSync(dataDir) && readdirSync(dataDir).length > 0) {
			throw new SetupError(
				`${dataDir} holds files but no MariaDB system tables.`,
				`Move that folder away (or delete ${options.home}) and run the command again.`
			);
		}
		rmSync(dataDir, { recursive: true, force: true });
		mkdirSync(initDir, { recursive: true });
		await runStep(
			`mariadb-install-db (initialising ${dataDir})`,
			'mariadb-install-db',
			['--no-defaults', `--datadir=${initDir}`, '--auth-root-authentication-method=normal', '--skip-test-db', ...asRoot],
			{
				quiet: true,
				fix: `Check free disk space and permissions on ${options.home}; to start over, delete that folder and run the command again.`
			}
		);
		renameSync(initDir, dataDir);
	}

	const admin = async <T>(statements: string[]) => {
		const conn = await mysql.createConnection({ socketPath: socket, user: 'root', multipleStatements: false });
		const results: T[] = [];
		try {
			for (const sql of statements) results.push((await conn.query(sql))[0] as T);
		} finally {
			await conn.end();
		}
		return results;
	};

	const earlierPid = processAlive(pidFile);
	if (earlierPid && (await canConnect(socket))) {
		note(`MariaDB from an earlier run is still up (pid ${earlierPid}); reusing it.`);
		const gone = async () => {
			for (let i = 0; i < 300 && processAlive(pidFile); i++) await new Promise((r) => setTimeout(r, 100));
		};
		const signal = () => {
			if (processAlive(pidFile)) process.kill(earlierPid, 'SIGTERM');
		};
		// Tracked like one we started, so a shutdown stops it too (SIGTERM: its clean shutdown).
		const untrack = track({ name: 'MariaDB', signal, stop: async () => (signal(), await gone()) });
		return {
			socket,
			port: options.port,
			process: null,
			admin,
			stop: async () => {
				signal();
				await gone();
				untrack();
			}
		};
	}

	await requireFreePort(options.port, 'MariaDB', options.portEnvName);
	step(`Starting MariaDB on 127.0.0.1:${options.port}…`);
	const log = openSync(errorLog, 'a');
	const proc = spawnManaged(
		'MariaDB',
		server,
		[
			'--no-defaults',
			`--datadir=${dataDir}`,
			`--socket=${socket}`,
			`--pid-file=${pidFile}`,
			`--tmpdir=${tmpDir}`,
			`--port=${options.port}`,
			'--bind-address=127.0.0.1',
			'--skip-name-resolve',
			'--character-set-server=utf8mb4',
			'--collation-server=utf8mb4_unicode_ci',
			'--default-time-zone=+00:00',
			// Acknowledged writes are durable: keep the default flush on every commit.
			'--innodb-flush-log-at-trx-commit=1',
			'--innodb-buffer-pool-size=128M',
			'--max-connections=200',
			...asRoot
		],
		{ logFile: log }
	);
	closeSync(log);

	const deadline = Date.now() + 60_000;
	while (!(await canConnect(socket))) {
		if (shuttingDown()) throw new Interrupted();
		if (proc.exited() || Date.now() > deadline) {
			await proc.stop(2000);
			throw new SetupError(
				`MariaDB did not start. The end of its log (${errorLog}):\n${tailOf(errorLog)}`,
				'A full disk, a port already taken or a damaged data folder are the usual causes; fix what the log says. ' +
					`To start over with an empty database, delete ${options.home}.`
			);
		}
		await new Promise((r) => setTimeout(r, 200));
	}
	ok(`MariaDB is up (socket ${socket}).`);
	return { socket, port: options.port, process: proc, admin, stop: () => proc.stop() };
}

const ident = (name: string) => {
	if (!/^[A-Za-z0-9_]+$/.test(name)) throw new Error(`unsafe identifier ${name}`);
	return '`' + name + '`';
};

/**
 * The application's database and its own user (never root). `extraPattern` grants the same user
 * rights on databases matching a LIKE pattern, so integration tests can create scratch databases.
 */
export async function ensureDatabase(
	db: RunningMariaDb,
	options: { database: string; user: string; password: string; recreate?: boolean; extraPattern?: string }
): Promise<void> {
	const quotedPassword = `'${options.password.replaceAll("'", "''")}'`;
	const statements = [
		...(options.recreate ? [`DROP DATABASE IF EXISTS ${ident(options.database)}`] : []),
		`CREATE DATABASE IF NOT EXISTS ${ident(options.database)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`
	];
	for (const host of ['127.0.0.1', 'localhost']) {
		const account = `'${options.user}'@'${host}'`;
		statements.push(
			`CREATE USER IF NOT EXISTS ${account} IDENTIFIED BY ${quotedPassword}`,
			`ALTER USER ${account} IDENTIFIED BY ${quotedPassword}`,
			`GRANT ALL PRIVILEGES ON ${ident(options.database)}.* TO ${account}`
		);
		if (options.extraPattern) {
			statements.push(`GRANT ALL PRIVILEGES ON \`${options.extraPattern}\`.* TO ${account}`);
		}
	}
	await db.admin(statements);
}
