// A browser test waits for real pages and a real server; jest's 5 s default is too short.
jest.setTimeout(60_000);
