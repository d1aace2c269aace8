import mysql from 'mysql2/promise';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { dataRoot, portsFor } from './scripts/lib/stack';
const secrets = JSON.parse(readFileSync(join(dataRoot, 'secrets.json'), 'utf8'));
const db = await mysql.createConnection({ host: '127.0.0.1', port: portsFor('test').db, user: 'riparia', password: secrets.dbPassword, database: 'riparia_test' });
const [rows] = await db.query(process.argv[2]!);
console.table(rows);
await db.end();
