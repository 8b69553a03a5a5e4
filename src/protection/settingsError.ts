// A typed error for computing with impossible settings; it carries the same messages the checker gives.
import type { Message } from "./types.ts";

export class SettingsError extends Error {
  readonly messages: readonly Message[];
  constructor(messages: readonly Message[]) {
    super(messages.map((m) => m.text).join("\n"));
    this.name = "SettingsError";
    this.messages = messages;
  }
}
