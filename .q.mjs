import mysql from 'mysql2/promise';
import { readFileSync } from 'node:fs';
const secrets = JSON.parse(readFileSync('.data/secrets.json', 'utf8'));
const port = 3306 + 300 + 5; 
