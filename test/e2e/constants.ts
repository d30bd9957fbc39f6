export const E2E_PASSWORD = 'speedwright-e2e-password';
