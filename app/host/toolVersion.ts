import packageJson from '../../package.json';

/** Name and version of this tool as printed on what it writes, e.g. 'chelation-ledger 0.1.0'. */
export const toolVersion = `${packageJson.name} ${packageJson.version}`;
