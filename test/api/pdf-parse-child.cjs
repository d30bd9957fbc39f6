// Reads a PDF from stdin with pdf-parse and prints { text, info, pages } as JSON; with
// --page-1-png also page 1 rendered (3 px per pt) as a base64 PNG in `page1Png`. Run as a child
// process (readPdf in test/api/read-pdf.ts): pdf.js loads its worker with a dynamic import, which jest's VM
// sandbox refuses without --experimental-vm-modules.
const { PDFParse } = require('pdf-parse');

const chunks = [];
process.stdin.on('data', (chunk) => chunks.push(chunk));
process.stdin.on('end', async () => {
  const parser = new PDFParse({ data: Buffer.concat(chunks) });
  try {
    const text = await parser.getText();
    const info = await parser.getInfo();
    let page1Png;
    if (process.argv.includes('--page-1-png')) {
      const shot = await parser.getScreenshot({ partial: [1], scale: 3, imageDataUrl: false, imageBuffer: true });
      page1Png = Buffer.from(shot.pages[0].data).toString('base64');
    }
    process.stdout.write(JSON.stringify({ text: text.text, pages: text.total, info: info.info, page1Png }));
  } catch (error) {
    process.stderr.write(String(error && error.stack ? error.stack : error));
    process.exitCode = 1;
  } finally {
    await parser.destroy();
  }
});
