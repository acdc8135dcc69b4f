// Placeholder replaced below once the database helpers exist.
export default async function setup(): Promise<void> {}
