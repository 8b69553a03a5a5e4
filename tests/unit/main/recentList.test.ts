// Recent-files list rules from the project brief: most recent first, at most 10, no duplicates,
// files that no longer exist dropped.
import { describe, expect, it } from "vitest";
import { RECENT_MAX, addRecent, dropMissing, parseRecent, serializeRecent } from "../../../main/recentList.ts";

describe("recent files list", () => {
  it("puts the newest file first", () => {
    expect(addRecent(["/a.islet", "/b.islet"], "/c.islet")).toEqual(["/c.islet", "/a.islet", "/b.islet"]);
  });

  it("moves a file already in the list to the top instead of listing it twice", () => {
    expect(addRecent(["/a.islet", "/b.islet", "/c.islet"], "/b.islet")).toEqual(["/b.islet", "/a.islet", "/c.islet"]);
  });

  it("treats paths differing only in case as one file where the file system does", () => {
    expect(addRecent(["C:\\Sites\\A.islet"], "c:\\sites\\a.islet", true)).toEqual(["c:\\sites\\a.islet"]);
    expect(addRecent(["/Sites/A.islet"], "/sites/a.islet", false)).toHaveLength(2);
  });

  it("keeps at most 10 files, dropping the oldest", () => {
    expect(RECENT_MAX).toBe(10); // project brief: max 10
    let list: string[] = [];
    for (let i = 1; i <= 13; i++) list = addRecent(list, `/p${i}.islet`);
    expect(list).toHaveLength(10);
    expect(list[0]).toBe("/p13.islet");
    expect(list[9]).toBe("/p4.islet"); // 13 added, the 3 oldest (p1..p3) gone
  });

  it("drops files that no longer exist", () => {
    const present = new Set(["/a.islet", "/c.islet"]);
    expect(dropMissing(["/a.islet", "/b.islet", "/c.islet"], (p) => present.has(p))).toEqual(["/a.islet", "/c.islet"]);
  });

  it("reads back what it writes", () => {
    const list = ["/x.islet", "/y.islet"];
    expect(parseRecent(serializeRecent(list))).toEqual(list);
  });

  it("reads a damaged or foreign recent.json as an empty list", () => {
    expect(parseRecent("{not json")).toEqual([]);
    expect(parseRecent('{"files": "nope"}')).toEqual([]);
    expect(parseRecent("[1,2]")).toEqual([]);
  });

  it("cleans a hand-edited list: non-strings, duplicates and overflow removed, order kept", () => {
    const files = ["/a.islet", 7, "/b.islet", "/a.islet", "", ...Array.from({ length: 12 }, (_, i) => `/q${i}.islet`)];
    const list = parseRecent(JSON.stringify({ files }));
    expect(list.slice(0, 3)).toEqual(["/a.islet", "/b.islet", "/q0.islet"]);
    expect(list).toHaveLength(10);
  });
});
