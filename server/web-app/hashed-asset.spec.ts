import { isHashedAsset } from './hashed-asset';

// File names as the Angular 21 application builder writes them (seen in dist/app/browser).
describe('isHashedAsset', () => {
  it('takes the build’s hashed scripts and styles, whatever characters the hash uses', () => {
    for (const name of ['main-ABCD1234.js', 'chunk-00IIRzsy.js', 'chunk-BL16E4-H.js', 'chunk-BT4gjyk_.js', 'polyfills-Xy12Ab34.js', 'styles-Q1w2E3r4.css']) {
      expect(isHashedAsset(`/srv/app/browser/${name}`)).toBe(true);
    }
    expect(isHashedAsset('/srv/app/browser/media/roboto-latin-400-normal-ABCD.woff2')).toBe(true);
  });

  it('asks again for everything whose name does not change with its content', () => {
    for (const name of ['index.html', 'ngsw.json', 'ngsw-worker.js', 'safety-worker.js', 'manifest.webmanifest', 'chunk-short.js', 'main.js', 'styles-ABCDEFGHI.css']) {
      expect(isHashedAsset(`/srv/app/browser/${name}`)).toBe(false);
    }
  });
});
