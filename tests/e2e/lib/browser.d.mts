import type { BrowserContext } from "playwright-core";
export const CHROMIUM: string;
export function launchStudioBrowser(viewport?: { width: number; height: number }): Promise<{ context: BrowserContext; close: () => Promise<void> }>;
