/** Entry of the language server: `node dist/server.js --stdio` (or node IPC when started by the client). */
import { createConnection, ProposedFeatures } from 'vscode-languageserver/node';
import { startServer } from './server';

startServer(createConnection(ProposedFeatures.all));
