// `npm run cluster`: the production shape on this machine — nginx in front of two app instances,
// two standalone workers (outbox and periodic jobs), one MariaDB and the storage and mail fakes —
// with the same data, ports and demo club as `npm start`. nginx listens on PORT (3000); the
// instances on PORT + 1 and PORT + 2. Ctrl-C stops everything in order.
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { orderlyShutdown } from './lib/children';
import { SetupError, ok, reportFailure, step } from './lib/log';
import { bringUp, dataRoot, portsFor } from './lib/stack';
import { startCluster } from './lib/cluster';

const started = Date.now();
// Every process is tracked from its start and stopped newest first: nginx, workers, instances, fakes, MariaDB.
const { shutdown, stopping } = orderlyShutdown();

try {
	const dotenv = join(import.meta.dirname, '..', '.env');
	if (existsSync(dotenv)) process.loadEnvFile(dotenv);
	if (process.env.NODE_ENV === 'test') throw new SetupError('NODE_ENV=test is set.', 'Unset NODE_ENV for `npm run cluster`.');
	const ports = portsFor('start');
	const stack = await bringUp({ mode: 'start', home: join(dataRoot, 'start'), ports, database: 'riparia', fresh: false });
	step('Starting two app instances, two workers and nginx…');
	const cluster = await startCluster({
		env: stack.env,
		home: join(dataRoot, 'cluster'),
		publicPort: ports.app,
		appPorts: [ports.app + 1, ports.app + 2],
		workers: 2,
		origin: stack.urls.app,
		portEnvName: 'PORT'
	});
	void cluster.exited.then((name) => {
		if (stopping()) return;
		console.error(`\n✗ ${name} stopped unexpectedly; see its output above.`);
		void shutdown(1);
	});
	ok(`Riparia (cluster) is ready in ${((Date.now() - started) / 1000).toFixed(1)} s at ${stack.urls.app}`);
	console.log(`
  nginx ${stack.urls.app} → app instances ${cluster.instances.map((i) => i.url).join(' and ')}
  two workers deliver mail (inbox ${stack.urls.mail}) and run the periodic jobs.
  nginx's configuration and logs: ${join(dataRoot, 'cluster', 'nginx')}
  Press Ctrl-C to stop nginx, the instances, the workers, the fakes and MariaDB.
`);
} catch (error) {
	reportFailure(error);
	await shutdown(1);
}
