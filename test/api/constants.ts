/** The demo password as the API tests seed it. */
export const TEST_PASSWORD = 'speedwright-test-password';
