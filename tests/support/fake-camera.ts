import fs from 'node:fs';

/**
 * Writes a one-frame Y4M video (the YUV4MPEG2 format Chromium's fake camera reads with
 * --use-file-for-fake-video-capture) showing a grey image centred on white: a label held
 * up to the phone. 4:2:0 chroma at 128 keeps it grey.
 */
export function writeLabelVideo(
  file: string,
  image: { width: number; height: number; grey: Uint8Array },
  width = 640,
  height = 480,
) {
  if (image.width > width || image.height > height)
    throw new Error('the label image is larger than the frame');
  const y = new Uint8Array(width * height).fill(255);
  const left = Math.floor((width - image.width) / 2);
  const top = Math.floor((height - image.height) / 2);
  for (let row = 0; row < image.height; row++) {
    y.set(
      image.grey.subarray(row * image.width, (row + 1) * image.width),
      (top + row) * width + left,
    );
  }
  const chroma = new Uint8Array((width / 2) * (height / 2)).fill(128);
  const header = Buffer.from(
    `YUV4MPEG2 W${width} H${height} F10:1 Ip A1:1 C420jpeg\nFRAME\n`,
    'latin1',
  );
  fs.writeFileSync(file, Buffer.concat([header, y, chroma, chroma]));
}
