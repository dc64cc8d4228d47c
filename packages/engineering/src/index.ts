// The engineering package's public entry; its computations arrive with the engineering work.
export {};
