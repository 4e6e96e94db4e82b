export * from './connection.js';
export * from './wire.js';
export { KernelServer, kernelIdFromFile, type KernelServerOptions } from './server.js';
export { kernelInfoContent, cellCompilerVersion } from './kernelInfo.js';
export { runKernel } from './main.js';
