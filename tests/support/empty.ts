/** Stand-in for the `server-only` marker package inside vitest (it throws outside React's server build). */
export {};
