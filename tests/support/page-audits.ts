import type { Page } from 'playwright-core';

/*
 * Checks that axe leaves to people: the contrast of focus rings and field borders against the
 * surface they sit on (WCAG 2.2 success criterion 1.4.11, non-text contrast, 3:1), and text that
 * CSS would change on its way to the screen (text-transform turns "mL" into "ML").
 * Contrast by the WCAG 2.x relative-luminance formula (https://www.w3.org/TR/WCAG22/#dfn-contrast-ratio).
 */

export interface ContrastProblem {
  element: string;
  what: 'focus ring' | 'field border';
  ratio: number;
}

/** Runs in the page: contrast of each field's border, and of each focusable element's focus ring. */
export async function nonTextContrastProblems(page: Page): Promise<ContrastProblem[]> {
  // Keyboard use first, so programmatic focus shows the same ring as the Tab key (:focus-visible).
  await page.keyboard.press('Shift');
  return page.evaluate(() => {
    const channels = (colour: string): number[] | null => {
      const match = /rgba?\(([^)]+)\)/.exec(colour);
      if (!match) return null;
      const parts = match[1]!
        .split(/[\s,/]+/)
        .filter(Boolean)
        .map(Number);
      return [parts[0]!, parts[1]!, parts[2]!, parts[3] ?? 1];
    };
    const luminance = ([r, g, b]: number[]) => {
      const linear = [r!, g!, b!].map((value) => {
        const unit = value / 255;
        return unit <= 0.03928 ? unit / 12.92 : ((unit + 0.055) / 1.055) ** 2.4;
      });
      return 0.2126 * linear[0]! + 0.7152 * linear[1]! + 0.0722 * linear[2]!;
    };
    const ratio = (a: number[], b: number[]) => {
      const [light, dark] = [luminance(a), luminance(b)].sort((x, y) => y - x);
      return (light! + 0.05) / (dark! + 0.05);
    };
    /** The first opaque background behind an element (its parents'), white if none. */
    const surfaceBehind = (element: Element): number[] => {
      for (let node = element.parentElement; node; node = node.parentElement) {
        const colour = channels(getComputedStyle(node).backgroundColor);
        if (colour && colour[3]! >= 0.95) return colour;
      }
      return [255, 255, 255, 1];
    };
    const describe = (element: Element) =>
      `${element.tagName.toLowerCase()}${element.id ? `#${element.id}` : ''} "${(
        element.getAttribute('aria-label') ??
        element.textContent ??
        ''
      )
        .trim()
        .slice(0, 40)}"`;
    const visible = (element: Element) => {
      const box = element.getBoundingClientRect();
      return box.width > 0 && box.height > 0 && getComputedStyle(element).visibility !== 'hidden';
    };

    const problems: Array<{ element: string; what: 'focus ring' | 'field border'; ratio: number }> = [];
    const fields = document.querySelectorAll(
      'input:not([type=checkbox]):not([type=radio]):not([type=file]):not([type=hidden]), select, textarea',
    );
    for (const field of fields) {
      if (!visible(field)) continue;
      const style = getComputedStyle(field);
      const border = channels(style.borderTopColor);
      if (!border || parseFloat(style.borderTopWidth) === 0) continue;
      const value = ratio(border, surfaceBehind(field));
      if (value < 3) problems.push({ element: describe(field), what: 'field border', ratio: value });
    }
    const focusable = document.querySelectorAll<HTMLElement>(
      'a[href], button:not([disabled]), input:not([disabled]):not([type=hidden]), select:not([disabled]), textarea:not([disabled]), [tabindex="0"]',
    );
    for (const element of focusable) {
      if (!visible(element)) continue;
      element.focus();
      if (document.activeElement !== element) continue;
      const style = getComputedStyle(element);
      const ring = channels(style.outlineColor);
      const shown = style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) >= 2;
      const surface = surfaceBehind(element);
      const value = shown && ring ? ratio(ring, surface) : 0;
      if (value < 3)
        problems.push({
          element: `${describe(element)} (${style.outlineStyle} ${style.outlineColor} on rgb(${surface.slice(0, 3).join(', ')}))`,
          what: 'focus ring',
          ratio: value,
        });
      element.blur();
    }
    return problems.map((problem) => ({ ...problem, ratio: Math.round(problem.ratio * 100) / 100 }));
  });
}

/** Runs in the page: elements whose visible text CSS changes (uppercase, lowercase, capitalize). */
export function transformedText(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const found: string[] = [];
    for (const element of document.querySelectorAll<HTMLElement>('body *')) {
      const transform = getComputedStyle(element).textTransform;
      if (transform !== 'none' && element.innerText?.trim())
        found.push(`${transform}: ${element.innerText.trim().slice(0, 40)}`);
    }
    return found;
  });
}
