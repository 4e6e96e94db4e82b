import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { requireFromPackage } from '../packageMode.js';
import { sagittaVersion } from '../version.js';
import { PROTOCOL_VERSION } from './wire.js';

/**
 * The TypeScript compiler that checks and compiles cells (tslab's bundled one), read from its
 * package.json so that answering kernel_info does not load the compiler.
 */
export function cellCompilerVersion(): string {
  const fromTslab = createRequire(requireFromPackage.resolve('tslab/package.json'));
  const file = fromTslab.resolve('@tslab/typescript-for-tslab/package.json');
  return (JSON.parse(readFileSync(file, 'utf8')) as { version: string }).version;
}

/** Content of kernel_info_reply (messaging spec, "Kernel info"): the true versions of what runs cells. */
export function kernelInfoContent(): Record<string, unknown> {
  const ts = cellCompilerVersion();
  const sagitta = sagittaVersion();
  return {
    status: 'ok',
    protocol_version: PROTOCOL_VERSION,
    implementation: 'sagitta',
    implementation_version: sagitta,
    language_info: {
      name: 'typescript',
      version: ts,
      mimetype: 'text/typescript',
      file_extension: '.ts',
      codemirror_mode: { name: 'javascript', typescript: true },
      pygments_lexer: 'typescript',
    },
    banner: `Sagitta ${sagitta} — TypeScript ${ts} on Node.js ${process.versions.node}`,
    help_links: [],
    debugger: false,
    sagitta_versions: { sagitta, typescript: ts, node: process.versions.node },
  };
}
