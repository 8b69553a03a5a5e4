import { describe, expect, it } from "vitest";
import { clampCursor, cursorForDevice, moveChainCursor } from "../../../renderer/panes/chain/chainCursor.ts";

const paths = [
  { links: [{ device: "F1" }, { device: "B2" }, { device: "R3" }] },
  { links: [] },
  { links: [{ device: "G1" }, { device: "R3" }] },
];

describe("stepping through primary and backup chains with the keyboard", () => {
  it("starts on the primary of the first path", () => {
    expect(clampCursor(paths, null)).toEqual({ path: 0, step: 0 });
  });
  it("goes down to the backup and stops at the last one", () => {
    expect(moveChainCursor(paths, { path: 0, step: 0 }, "ArrowDown")).toEqual({ path: 0, step: 1 });
    expect(moveChainCursor(paths, { path: 0, step: 2 }, "ArrowDown")).toEqual({ path: 0, step: 2 });
  });
  it("goes up towards the primary and stops there", () => {
    expect(moveChainCursor(paths, { path: 0, step: 1 }, "ArrowUp")).toEqual({ path: 0, step: 0 });
    expect(moveChainCursor(paths, { path: 0, step: 0 }, "ArrowUp")).toEqual({ path: 0, step: 0 });
  });
  it("skips a path without devices and keeps the depth where it can", () => {
    expect(moveChainCursor(paths, { path: 0, step: 1 }, "ArrowRight")).toEqual({ path: 2, step: 1 });
    // path 2 has two steps: from depth 2 it lands on its last one
    expect(moveChainCursor(paths, { path: 0, step: 2 }, "ArrowRight")).toEqual({ path: 2, step: 1 });
    expect(moveChainCursor(paths, { path: 2, step: 0 }, "ArrowLeft")).toEqual({ path: 0, step: 0 });
  });
  it("stays put at the first and last path", () => {
    expect(moveChainCursor(paths, { path: 0, step: 0 }, "ArrowLeft")).toEqual({ path: 0, step: 0 });
    expect(moveChainCursor(paths, { path: 2, step: 0 }, "ArrowRight")).toEqual({ path: 2, step: 0 });
  });
  it("jumps to the ends of a path with Home and End", () => {
    expect(moveChainCursor(paths, { path: 0, step: 1 }, "End")).toEqual({ path: 0, step: 2 });
    expect(moveChainCursor(paths, { path: 0, step: 2 }, "Home")).toEqual({ path: 0, step: 0 });
  });
  it("has nowhere to go without any device", () => {
    expect(moveChainCursor([{ links: [] }], null, "ArrowDown")).toBeNull();
  });
});

describe("finding a device picked elsewhere", () => {
  it("prefers the current path for a backup shared by two paths", () => {
    expect(cursorForDevice(paths, "R3", 2)).toEqual({ path: 2, step: 1 });
  });
  it("otherwise takes its shallowest place", () => {
    expect(cursorForDevice(paths, "R3")).toEqual({ path: 2, step: 1 });
    expect(cursorForDevice(paths, "F1")).toEqual({ path: 0, step: 0 });
  });
  it("answers null for a device on no path", () => {
    expect(cursorForDevice(paths, "X9")).toBeNull();
  });
});
