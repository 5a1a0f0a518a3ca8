// Argon2 hashing, image work and a real PostgreSQL on a shared two-core machine: jest's 5 s is not enough
// under load (testTimeout is a global option in a multi-project config, so the API project sets it here).
jest.setTimeout(30_000);
