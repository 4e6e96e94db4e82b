export { readConnectionFile, endpoint, type ConnectionInfo, type Channel } from './connection.js';
export { decode, encode, makeHeader, sign, SignatureHistory, DELIMITER, PROTOCOL_VERSION, type Header, type Message, type DecodeFailure } from './wire.js';
export { KernelServer, kernelIdFromFile, nextIndent, type KernelServerOptions } from './server.js';
export { ExecutionHistory, globToRegExp, type HistoryEntry } from './history.js';
export { kernelInfoContent, cellCompilerVersion } from './kernelInfo.js';
export { runKernel } from './main.js';
