// Integration tests talk to the real MariaDB and the running app that `npm test` started.
export default function setup() {
	for (const name of ['DATABASE_URL', 'APP_URL', 'MAIL_UI_URL']) {
		if (!process.env[name]) {
			throw new Error(`${name} is not set. Run integration tests with \`npm test\` (or \`npm test -- --only integration\`).`);
		}
	}
}
