import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Jimp } from "jimp";
import { runBounded } from "../../server/credentials/extraction/render-bounds.ts";
import { buildSeededRandom } from "../../server/db/demo-scenario/documents/build-seeded-random.ts";

/** How a page was "photographed": the turn (counter-clockwise degrees), blur radius, noise and light falloff. */
export interface PhotoStyle {
  degrees: number;
  blur: number;
  noise: number;
  /** 0 to 1: how much darker the far corner is than the near one, as under a desk lamp. */
  shade: number;
}

/** A style chosen from the seed: a few degrees of tilt, or a quarter or half turn, with blur, noise and shade. */
export function photoStyle(seed: number): PhotoStyle {
  const random = buildSeededRandom(seed);
  const turn = random.pick([0, 0, 90, 180]);
  return {
    degrees: turn + random.int(-40, 40) / 10,
    blur: random.pick([0, 1, 1, 2]),
    noise: random.pick([0, 12, 24]),
    shade: random.pick([0, 0.2, 0.35]),
  };
}

/** The first page of a PDF rendered by pdftoppm and photographed in the given style, as PNG bytes. */
export async function photographPage(pdf: Uint8Array, style: PhotoStyle, dpi = 200): Promise<Uint8Array> {
  const dir = await mkdtemp(join(tmpdir(), "clearbench-photo-"));
  try {
    await writeFile(join(dir, "doc.pdf"), pdf);
    await runBounded(
      "/usr/bin/pdftoppm",
      [
        "-r",
        String(dpi),
        "-f",
        "1",
        "-l",
        "1",
        "-singlefile",
        "-png",
        join(dir, "doc.pdf"),
        join(dir, "page"),
      ],
      { timeoutMs: 20_000, env: { PATH: "/usr/bin:/bin" }, maxBuffer: 1024 * 1024 },
    );
    const image = await Jimp.read(await readFile(join(dir, "page.png")));
    // Turned first, so the light and the sensor noise fall on the whole picture, page and corners alike.
    image.background = 0xffffffff;
    if (style.degrees) image.rotate(style.degrees);
    const { width, height, data } = image.bitmap;
    const random = buildSeededRandom(Math.round(style.degrees * 1000 + style.noise));
    for (let y = 0; y < height; y += 1) {
      for (let x = 0; x < width; x += 1) {
        const at = (y * width + x) * 4;
        const light = 1 - style.shade * ((x / width + y / height) / 2);
        const jitter = style.noise ? random.int(-style.noise, style.noise) : 0;
        for (let c = 0; c < 3; c += 1)
          data[at + c] = Math.max(0, Math.min(255, Math.round(data[at + c]! * light + jitter)));
      }
    }
    if (style.blur) image.blur(style.blur);
    return new Uint8Array(await image.getBuffer("image/png"));
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
