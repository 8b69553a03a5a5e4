// The desktop app's preload exposes window.isletHost; a plain browser gets the browser adapter.
import type { HostApi } from "../../src/model/hostContract.ts";
import { browserHost } from "./browserHost.ts";

declare global {
  interface Window {
    isletHost?: HostApi;
  }
}

export function pickHost(): HostApi {
  return window.isletHost ?? browserHost();
}
