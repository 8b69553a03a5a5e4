// The desktop app's preload exposes window.isletHost (wrapped by desktopHost); a plain browser
// gets the browser adapter.
import type { HostApi } from "../../src/model/hostContract.ts";
import { browserHost } from "./browserHost.ts";
import { desktopHost } from "./desktopHost.ts";

declare global {
  interface Window {
    isletHost?: HostApi;
  }
}

export function pickHost(): HostApi {
  return window.isletHost ? desktopHost(window.isletHost) : browserHost();
}
