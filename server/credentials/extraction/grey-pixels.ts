/**
 * Page images as one grey byte a pixel, and the work done on them in this process before tesseract reads them: turning
 * and levelling (here rather than by Jimp, whose general rotation took seconds a photo), and sharpening soft print.
 *
 * A photo's print softened by focus or hand shake loses the gaps that tell 0 from 6 and 2 from 7 once tesseract
 * binarises it; an unsharp mask (each pixel pushed away from the mean of its neighbourhood) restores enough of those
 * gaps to read them. A crisp page needs none and would only have its sensor noise raised, so how soft the print is is
 * measured first: how steep the page's sharpest edges are against the contrast between paper and ink.
 */

export interface GreyPixels {
  width: number;
  height: number;
  /** One byte a pixel, row by row. */
  grey: Uint8Array;
}

/** The grey of Jimp's RGBA bitmap: the mean of the three colours. */
export function greyOf({
  width,
  height,
  data,
}: {
  width: number;
  height: number;
  data: Uint8Array;
}): GreyPixels {
  const grey = new Uint8Array(width * height);
  for (let i = 0; i < grey.length; i += 1)
    grey[i] = Math.round((data[i * 4]! + data[i * 4 + 1]! + data[i * 4 + 2]!) / 3);
  return { width, height, grey };
}

/**
 * The image turned counter-clockwise by `degrees` about its centre onto a canvas that holds all of it, the corners
 * white, each pixel interpolated between the four it falls among.
 */
export function turnedGrey(image: GreyPixels, degrees: number): GreyPixels {
  const angle = (degrees * Math.PI) / 180;
  // Exact for quarter turns, where floating point would leave 6e-17 and blur every pixel with its neighbour.
  const round = (v: number) => (Math.abs(v) < 1e-9 ? 0 : Math.abs(Math.abs(v) - 1) < 1e-9 ? Math.sign(v) : v);
  const [cos, sin] = [round(Math.cos(angle)), round(Math.sin(angle))];
  const { width, height, grey } = image;
  const outWidth = Math.round(Math.abs(width * cos) + Math.abs(height * sin));
  const outHeight = Math.round(Math.abs(width * sin) + Math.abs(height * cos));
  const out = new Uint8Array(outWidth * outHeight).fill(255);
  const [cx, cy] = [(width - 1) / 2, (height - 1) / 2];
  const [ox, oy] = [(outWidth - 1) / 2, (outHeight - 1) / 2];
  for (let y = 0; y < outHeight; y += 1) {
    const dy = y - oy;
    for (let x = 0; x < outWidth; x += 1) {
      const dx = x - ox;
      // Where this pixel of the turned image was before the turn (y grows downwards).
      const sx = cx + dx * cos - dy * sin;
      const sy = cy + dx * sin + dy * cos;
      const x0 = Math.floor(sx);
      const y0 = Math.floor(sy);
      if (x0 < 0 || y0 < 0 || x0 >= width || y0 >= height) continue;
      const fx = sx - x0;
      const fy = sy - y0;
      const x1 = Math.min(width - 1, x0 + 1);
      const y1 = Math.min(height - 1, y0 + 1);
      const top = grey[y0 * width + x0]! * (1 - fx) + grey[y0 * width + x1]! * fx;
      const bottom = grey[y1 * width + x0]! * (1 - fx) + grey[y1 * width + x1]! * fx;
      out[y * outWidth + x] = Math.round(top * (1 - fy) + bottom * fy);
    }
  }
  return { width: outWidth, height: outHeight, grey: out };
}

/**
 * The steepest edges of the page (the 99.5th percentile of the step between neighbouring pixels along a row) as a
 * share of the contrast between paper and ink (95th against 2nd percentile of grey): near 1 on crisp print, falling
 * as blur spreads each edge over several pixels.
 */
export function edgeSteepness({ width, height, grey }: GreyPixels): number {
  const levels = new Uint32Array(256);
  const steps = new Uint32Array(256);
  // Every second row is plenty for a percentile and halves the time.
  for (let y = 0; y < height; y += 2) {
    const row = y * width;
    for (let x = 0; x < width; x += 1) {
      levels[grey[row + x]!]! += 1;
      if (x > 0) steps[Math.abs(grey[row + x]! - grey[row + x - 1]!)]! += 1;
    }
  }
  const percentile = (histogram: Uint32Array, share: number) => {
    const total = histogram.reduce((sum, n) => sum + n, 0);
    let seen = 0;
    for (let value = 0; value < 256; value += 1) {
      seen += histogram[value]!;
      if (seen >= share * total) return value;
    }
    return 255;
  };
  const contrast = percentile(levels, 0.95) - percentile(levels, 0.02);
  return contrast > 0 ? percentile(steps, 0.995) / contrast : 1;
}

/**
 * The mean grey of each pixel's square neighbourhood of `radius` pixels (cut at the edges), from an integral image, so
 * the cost does not grow with the radius.
 */
export function localMeans(
  width: number,
  height: number,
  grey: ArrayLike<number>,
  radius: number,
): Float64Array {
  const stride = width + 1;
  const sums = new Float64Array(stride * (height + 1));
  for (let y = 0; y < height; y += 1) {
    let row = 0;
    for (let x = 0; x < width; x += 1) {
      row += grey[y * width + x]!;
      sums[(y + 1) * stride + x + 1] = sums[y * stride + x + 1]! + row;
    }
  }
  const means = new Float64Array(width * height);
  for (let y = 0; y < height; y += 1) {
    const top = Math.max(0, y - radius);
    const bottom = Math.min(height, y + radius + 1);
    for (let x = 0; x < width; x += 1) {
      const left = Math.max(0, x - radius);
      const right = Math.min(width, x + radius + 1);
      means[y * width + x] =
        (sums[bottom * stride + right]! -
          sums[top * stride + right]! -
          sums[bottom * stride + left]! +
          sums[top * stride + left]!) /
        ((bottom - top) * (right - left));
    }
  }
  return means;
}

/** The grey pixels with an unsharp mask of the given strength over a square neighbourhood of `radius` pixels. */
export function unsharpGrey({ width, height, grey }: GreyPixels, amount: number, radius: number): GreyPixels {
  const means = localMeans(width, height, grey, radius);
  const out = new Uint8Array(width * height);
  for (let i = 0; i < out.length; i += 1) {
    const value = grey[i]!;
    out[i] = Math.max(0, Math.min(255, Math.round(value + amount * (value - means[i]!))));
  }
  return { width, height, grey: out };
}
