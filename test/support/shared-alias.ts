/**
 * jest's global setup and teardown files run in jest's own process, where `moduleNameMapper` does
 * not apply: this makes Node resolve the `@shared/…` alias (tsconfig.json `paths`) there, through
 * tsx's CommonJS hook. Import it first.
 */
import { register } from 'tsx/cjs/api';

register();
