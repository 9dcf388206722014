import type { Locator, Page } from 'playwright-core';

/**
 * Ionic keeps earlier pages of the stack in the DOM (hidden), so the same test id can exist more
 * than once: these helpers pick the one on screen.
 */
export function onScreen(page: Page | Locator, testId: string): Locator {
  return page.getByTestId(testId).filter({ visible: true });
}

/** Types into a field: a native input or textarea, or an Ionic input (its native input sits inside the host). */
export async function typeInto(page: Page | Locator, testId: string, text: string): Promise<void> {
  const field = onScreen(page, testId);
  const tag = await field.evaluate((element) => element.tagName);
  await (tag === 'INPUT' || tag === 'TEXTAREA' ? field : field.locator('input, textarea').first()).fill(text);
}

/** Chooses an option of a ChoiceGroup by its value. */
export async function choose(page: Page | Locator, groupTestId: string, value: string): Promise<void> {
  await onScreen(page, groupTestId).locator(`label[data-value="${value}"]`).click();
}

/** Reads the phone's IndexedDB table straight from the browser (no app code involved). */
export async function readTable<T = Record<string, unknown>>(page: Page, table: string): Promise<T[]> {
  return page.evaluate(
    (name) =>
      new Promise<T[]>((resolve, reject) => {
        const open = indexedDB.open('plummet');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const request = open.result.transaction(name, 'readonly').objectStore(name).getAll();
          request.onsuccess = () => {
            const rows = request.result.map((row: Record<string, unknown>) => {
              // Blobs do not cross into the test: describe them instead.
              const copy: Record<string, unknown> = { ...row };
              if (row.data instanceof Blob) copy.data = { blobType: row.data.type, blobSize: row.data.size };
              else if (row.data instanceof ArrayBuffer) copy.data = { bufferSize: row.data.byteLength };
              return copy as T;
            });
            open.result.close();
            resolve(rows);
          };
          request.onerror = () => reject(request.error);
        };
      }),
    table,
  );
}

/**
 * Saves the finding editor. A High finding with people below makes the app ask for it to be made
 * safe before leaving the bay; `whenAsked` says what to answer ('later' saves it still open).
 * Resolves once the editor has closed.
 */
export async function saveFinding(page: Page, whenAsked: 'later' | 'fail' = 'later'): Promise<boolean> {
  await onScreen(page, 'save-finding').click();
  const later = onScreen(page, 'make-safe-prompt-later');
  const editor = onScreen(page, 'finding-editor');
  for (;;) {
    if ((await later.count()) > 0) {
      if (whenAsked === 'fail') throw new Error('The app asked to make the finding safe first');
      await later.click();
      await editor.waitFor({ state: 'detached', timeout: 15_000 }).catch(() => editor.waitFor({ state: 'hidden', timeout: 15_000 }));
      return true;
    }
    if ((await editor.count()) === 0) return false;
    await page.waitForTimeout(50);
  }
}

/**
 * The visible rows of a list are laid out cleanly: no row's content spills out of its box (a fixed
 * height with wrapped text would), and no row's box overlaps the next. Returns the offences, each
 * naming the row's first words, so a failing test says which rows collide.
 */
export async function rowOverlaps(page: Page, testId: string): Promise<string[]> {
  return onScreen(page, testId).evaluateAll((rows) => {
    const offences: string[] = [];
    const boxes = rows.map((row) => row.getBoundingClientRect()).filter((box) => box.height > 0);
    rows.forEach((row, i) => {
      const box = row.getBoundingClientRect();
      const name = (row.textContent ?? '').trim().slice(0, 40);
      for (const child of Array.from(row.querySelectorAll('*'))) {
        const inner = child.getBoundingClientRect();
        if (inner.height > 0 && inner.bottom > box.bottom + 0.5) {
          offences.push(`${name}: content ends ${Math.round(inner.bottom - box.bottom)} px below its row`);
          break;
        }
      }
      const next = boxes[i + 1];
      if (next && box.bottom > next.top + 0.5 && box.top < next.top) offences.push(`${name}: overlaps the next row`);
    });
    return offences;
  });
}

/**
 * Waits until no finite animation runs (Ionic's page transitions use the Web Animations API), so a
 * screenshot shows one page rather than two crossing. Endless ones (a spinner) are left running.
 */
export async function settled(page: Page): Promise<void> {
  await page.waitForFunction(
    () => document.getAnimations().every((animation) => animation.playState !== 'running' || animation.effect?.getTiming().iterations === Infinity),
    undefined,
    { timeout: 10_000 },
  );
}
