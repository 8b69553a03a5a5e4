export function freePort(): Promise<number>;
export function startPreview(root: string): Promise<{ url: string; stop: () => Promise<void> }>;
