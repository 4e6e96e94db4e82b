/**
 * The lockfile of an empty project that depends on nothing but our packed tarball, derived from
 * our own lockfile: the same dependency tree (so `npm ci --offline` installs it from the cache
 * the checkout's own `npm ci` filled, with no registry access), without our dev dependencies.
 */
export interface Lockfile {
  name?: string;
  version?: string;
  lockfileVersion: number;
  requires?: boolean;
  packages: Record<string, Record<string, unknown>>;
}

export function consumerLockfile(ours: Lockfile, consumerName: string, tarballSpec: string): Lockfile {
  const root = ours.packages[''];
  const packages: Lockfile['packages'] = {
    '': { name: consumerName, dependencies: { [String(root.name)]: tarballSpec } },
    [`node_modules/${String(root.name)}`]: {
      version: root.version,
      resolved: tarballSpec,
      license: root.license,
      dependencies: root.dependencies,
      bin: root.bin,
      engines: root.engines,
    },
  };
  for (const [where, entry] of Object.entries(ours.packages)) {
    if (where === '' || entry.dev === true) continue;
    const { devOptional, ...rest } = entry;
    packages[where] = devOptional === true ? { ...rest, optional: true } : rest;
  }
  return { name: consumerName, lockfileVersion: ours.lockfileVersion, requires: true, packages };
}
