/** The speed card model: types, inputs schema, refusal, `buildCard` and `cardDigest`. */
export * from './card';
