import { closeOnSignal } from '../close-on-signal';
import { startFakeGitHub } from './fake-github';

const port = Number(process.env['FAKE_GITHUB_PORT'] ?? 3101);
const host = process.env['FAKE_HOST'] ?? '127.0.0.1';

const fake = await startFakeGitHub({ port, host });
console.log(`Fake GitHub listening on ${fake.url}`);
closeOnSignal('Fake GitHub', () => fake.close());
