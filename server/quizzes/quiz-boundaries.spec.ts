import { readdirSync, readFileSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { join, relative } from 'node:path';

// Keys, rubrics and explanations stay on the server: the Angular app imports neither the quiz
// definitions nor the loader, and shared/quiz (which the app may use for types and units) needs no
// Node built-in.
const ROOT = join(__dirname, '../..');

function tsFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && e.name.endsWith('.ts'))
    .map((e) => join(e.parentPath, e.name));
}

const importsOf = (file: string) => [...readFileSync(file, 'utf8').matchAll(/(?:import|export)[^'"]*?from\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)|require\(\s*['"]([^'"]+)['"]\s*\)/g)].map((m) => m[1] ?? m[2] ?? m[3]!);

describe('quiz boundaries', () => {
  it('nothing in src/ imports the quiz definitions, the loader or any server module', () => {
    const files = tsFiles(join(ROOT, 'src'));
    expect(files.length).toBeGreaterThan(20);
    const offending = files
      .flatMap((file) => importsOf(file).map((path) => `${relative(ROOT, file)} → ${path}`))
      .filter((line) => /quiz\/definition|quiz-library|(^|\/)server\/|content\/quizzes/.test(line.split(' → ')[1]!));
    expect(offending).toEqual([]);
  });

  it('shared/quiz uses no Node built-in outside its tests', () => {
    const builtins = new Set(builtinModules.flatMap((m) => [m, `node:${m}`]));
    const offending = tsFiles(join(ROOT, 'shared/quiz'))
      .filter((file) => !file.endsWith('.spec.ts'))
      .flatMap((file) => importsOf(file).filter((path) => builtins.has(path) || path.startsWith('node:')).map((path) => `${relative(ROOT, file)} → ${path}`));
    expect(offending).toEqual([]);
  });
});
