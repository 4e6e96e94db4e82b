export * from './connection';
export * from './wire';
export { KernelServer, kernelIdFromFile, type KernelServerOptions } from './server';
export { kernelInfoContent, cellCompilerVersion } from './kernelInfo';
export { runKernel } from './main';
