// The host the studio runs in, chosen once at start-up (see pickHost) and read by the commands.
import type { HostApi } from "../../src/model/hostContract.ts";

let host: HostApi | null = null;

export function setHost(next: HostApi): void {
  host = next;
}

export function currentHost(): HostApi {
  if (!host) throw new Error("The studio's host is not set yet");
  return host;
}
