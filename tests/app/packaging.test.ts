import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import Ajv from 'ajv';
import { parse } from 'yaml';

const root = fileURLToPath(new URL('../..', import.meta.url));
const config = parse(readFileSync(`${root}electron-builder.yml`, 'utf8'));
const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8'));

// electron-builder cannot run here (it downloads Electron), so the configuration is
// checked as data against the Electron security checklist (electronjs.org/docs/latest/
// tutorial/security, "fuses" and "asar integrity" items) and against package.json.
describe('repository layout (design card)', () => {
  it('has the top-level entries the design card lists', async () => {
    const { existsSync } = await import('node:fs');
    for (const entry of ['package.json', 'electron-builder.yml', 'tsconfig.json', 'README.md', 'DEVELOPERS.md', 'app', 'renderer', 'core', 'tests', 'assets', '.ci/run']) {
      expect(existsSync(`${root}${entry}`), entry).toBe(true);
    }
  });
});

describe('electron-builder.yml', () => {
  it('is valid YAML naming the product as package.json does', () => {
    expect(config.productName).toBe(pkg.name);
    expect(config.appId).toMatch(/^[a-z0-9.-]+$/);
  });

  it('ships the app in an asar archive with the security fuses set', () => {
    expect(config.asar).toBe(true);
    expect(config.electronFuses).toEqual({
      runAsNode: false,
      enableCookieEncryption: true,
      enableNodeOptionsEnvironmentVariable: false,
      enableNodeCliInspectArguments: false,
      enableEmbeddedAsarIntegrityValidation: true,
      onlyLoadAppFromAsar: true,
      grantFileProtocolExtraPrivileges: false,
    });
  });

  it('is valid against electron-builder\'s own JSON Schema (app-builder-lib/scheme.json, checked with ajv)', () => {
    const schema = JSON.parse(readFileSync(`${root}node_modules/app-builder-lib/scheme.json`, 'utf8'));
    const validate = new Ajv({ allErrors: true, strict: false }).compile(schema);
    expect(validate(config), JSON.stringify(validate.errors)).toBe(true);
    // Compiling electron-builder's large schema is slow on a shared machine: a limit, not a timing.
  }, 30_000);

  it('builds AppImage and deb for Linux, an NSIS installer for Windows and a dmg for macOS', () => {
    expect(config.linux.target).toEqual(['AppImage', 'deb']);
    expect(config.win.target).toEqual(['nsis']);
    expect(config.mac.target).toEqual(['dmg']);
  });

  it('uses the icon in assets/ (a PNG of at least 512 × 512, which electron-builder converts for every platform)', () => {
    for (const icon of [config.icon, config.linux.icon, config.win.icon, config.mac.icon]) {
      expect(icon).toBe('assets/icon.png');
    }
    const png = readFileSync(`${root}assets/icon.png`);
    // PNG signature and IHDR width/height (PNG specification, ISO/IEC 15948 §5.2, §11.2.2).
    expect(png.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
    expect(png.readUInt32BE(16)).toBeGreaterThanOrEqual(512);
    expect(png.readUInt32BE(20)).toBeGreaterThanOrEqual(512);
  });

  it('associates case files (JSON) with the app without claiming to be the default for every .json', () => {
    expect(config.fileAssociations).toEqual([expect.objectContaining({ ext: 'json', mimeType: 'application/json', rank: 'Alternate' })]);
  });

  it('points Electron at the built main process and ships the demo cases the first run opens', () => {
    expect(pkg.main).toBe('dist/main/main.cjs');
    expect(config.files).toContain('assets/demo/*.json');
    expect(pkg.devDependencies.electron).toMatch(/^\d+\.\d+\.\d+$/);
    expect(pkg.devDependencies['electron-builder']).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('packages only built output and package.json, never sources or tests', () => {
    expect(config.files).toContain('dist/**/*');
    expect(config.files.some((it: string) => it.startsWith('core') || it.startsWith('tests'))).toBe(false);
  });

  it('keeps React and build tools out of the runtime dependencies (stack notes)', () => {
    const runtime = Object.keys(pkg.dependencies ?? {});
    for (const devOnly of ['react', 'react-dom', 'vite', 'vitest', 'typescript', 'esbuild', 'electron']) {
      expect(runtime).not.toContain(devOnly);
    }
  });
});
