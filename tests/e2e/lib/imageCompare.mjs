// Compares two PNGs with the browser's own decoder: the share of pixels whose colour differs by
// more than `channelTolerance` in any channel. No image library needed.
import { readFile } from "node:fs/promises";

/** @returns {Promise<{ ratio: number, width: number, height: number, sameSize: boolean }>} */
export async function pixelDifference(context, pngA, pngB, channelTolerance = 24) {
  const [a, b] = await Promise.all([readFile(pngA), readFile(pngB)]);
  const page = await context.newPage();
  try {
    return await page.evaluate(
      async ({ a64, b64, tol }) => {
        const load = async (b64url) => {
          const img = new Image();
          img.src = b64url;
          await img.decode();
          const c = document.createElement("canvas");
          c.width = img.naturalWidth;
          c.height = img.naturalHeight;
          const ctx = c.getContext("2d");
          ctx.drawImage(img, 0, 0);
          return ctx.getImageData(0, 0, c.width, c.height);
        };
        const [da, db] = await Promise.all([load(a64), load(b64)]);
        if (da.width !== db.width || da.height !== db.height) return { ratio: 1, width: da.width, height: da.height, sameSize: false };
        let differ = 0;
        for (let i = 0; i < da.data.length; i += 4) {
          if (Math.abs(da.data[i] - db.data[i]) > tol || Math.abs(da.data[i + 1] - db.data[i + 1]) > tol || Math.abs(da.data[i + 2] - db.data[i + 2]) > tol) differ++;
        }
        return { ratio: differ / (da.width * da.height), width: da.width, height: da.height, sameSize: true };
      },
      { a64: `data:image/png;base64,${a.toString("base64")}`, b64: `data:image/png;base64,${b.toString("base64")}`, tol: channelTolerance },
    );
  } finally {
    await page.close();
  }
}
