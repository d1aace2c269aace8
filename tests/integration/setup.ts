// Runs in each integration test file before its tests: the tests call domain functions directly,
// so the photo scopes must be registered with media as the app's hooks do.
import { registerMediaScopes } from '../../src/lib/server/media-scopes';

registerMediaScopes();
