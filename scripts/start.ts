// `npm start`: set up what is missing, then serve the app with the demo club until Ctrl-C.
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { orderlyShutdown } from './lib/children';
import { SetupError, ok, reportFailure, step } from './lib/log';
import { bringUp, dataRoot, portsFor } from './lib/stack';
import { DEMO_SIGN_IN } from './seed/people';

const started = Date.now();
// Every process started below is tracked from its start, so Ctrl-C or SIGTERM at any step stops them all.
const { shutdown, stopping } = orderlyShutdown();

try {
	const dotenv = join(import.meta.dirname, '..', '.env');
	if (existsSync(dotenv)) process.loadEnvFile(dotenv);
	if (process.env.NODE_ENV === 'test') throw new SetupError('NODE_ENV=test is set.', 'Use `npm test` for tests; unset NODE_ENV for `npm start`.');
	const stack = await bringUp({ mode: 'start', home: join(dataRoot, 'start'), ports: portsFor('start'), database: 'riparia', fresh: false });
	step('Starting the app…');
	const app = await stack.serve();
	void app.exited.then((code) => {
		if (stopping()) return;
		console.error(`\n✗ The app stopped unexpectedly (exit code ${code}); see its output above.`);
		void shutdown(1);
	});
	const seconds = ((Date.now() - started) / 1000).toFixed(1);
	ok(`Riparia is ready in ${seconds} s at ${stack.urls.app}`);
	console.log(`
  Open ${stack.urls.app} and sign in with one of the demo addresses below.
  The sign-in link arrives in the local mail inbox: ${stack.urls.mail}

${DEMO_SIGN_IN.map((p) => `    ${p.role.padEnd(7)} ${p.email.padEnd(32)} ${p.name}`).join('\n')}

  Photos are kept by the local storage fake at ${stack.urls.s3}
  Health: ${stack.urls.app}/readyz · metrics (this machine only): ${stack.urls.metrics}
  Press Ctrl-C to stop the app, the fakes and MariaDB.
`);
} catch (error) {
	reportFailure(error);
	await shutdown(1);
}
