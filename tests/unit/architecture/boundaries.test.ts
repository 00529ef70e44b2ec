/**
 * The boundaries between the app's parts are lint errors: each case below is an import across one of them,
 * linted as if it sat at the given path, and must be refused by the project's own ESLint config.
 */
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const eslint = new ESLint({ cwd: new URL('../../..', import.meta.url).pathname });

/** The rule ids ESLint reports for a source text placed at a path inside the project. */
async function restrictionsAt(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.map((m) => m.ruleId ?? m.message).filter((id) => /no-restricted-imports/.test(id));
}

const vue = (script: string) => `<template><div /></template>\n<script setup lang="ts">\n${script}\n</script>\n`;

describe('import boundaries', () => {
  it.each([
    ['shared/kinematics/example.ts', "import { ref } from 'vue';\nexport const a = ref(1);\n"],
    ['shared/kinematics/example.ts', "import Konva from 'konva';\nexport const a = Konva;\n"],
    ['shared/kinematics/example.ts', "import { Model } from 'sequelize';\nexport const a = Model;\n"],
    ['shared/kinematics/example.ts', "import { useStorage } from '@vueuse/core';\nexport const a = useStorage;\n"],
    [
      'shared/kinematics/example.ts',
      "import { useBoardStore } from '../../src/stores/board';\nexport const a = useBoardStore;\n",
    ],
    ['shared/schema/example.ts', "import { runSweep } from '../kinematics/run';\nexport const a = runSweep;\n"],
    ['shared/kinematics/index.ts', "export { sketchSchema } from '../schema/sketch';\n"],
    ['src/stores/example.ts', "import { buildApp } from '../../server/app';\nexport const a = buildApp;\n"],
    ['src/components/BoardExample.vue', vue("import { User } from '../../server/models';\nconsole.log(User);")],
    [
      'server/routes/example.ts',
      "import { useBoardStore } from '../../src/stores/board';\nexport const a = useBoardStore;\n",
    ],
    ['server/routes/example.ts', "import { ref } from 'vue';\nexport const a = ref;\n"],
  ])('%s refuses %j', async (path, code) => {
    expect(await restrictionsAt(path, code)).not.toHaveLength(0);
  });

  it.each([
    ['shared/kinematics/example.ts', "import { Matrix } from 'ml-matrix';\nexport const a = Matrix;\n"],
    ['shared/kinematics/index.ts', "export type { Sketch } from '../schema/sketch';\n"],
    ['src/stores/example.ts', "import { runSweep } from '../../shared/kinematics';\nexport const a = runSweep;\n"],
    [
      'server/routes/example.ts',
      "import { sketchSchema } from '../../shared/schema/sketch';\nexport const a = sketchSchema;\n",
    ],
  ])('%s allows %j', async (path, code) => {
    expect(await restrictionsAt(path, code)).toEqual([]);
  });
});
