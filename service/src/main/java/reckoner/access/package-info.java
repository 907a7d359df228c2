/**
 * Access: API keys read from the keys file (each a hashed secret, scopes and an optional rate),
 * authentication of a presented secret in constant time, per-key rate limits and per-key stream
 * counts, and the command that makes a key line.
 *
 * <p>Design notes: depends on the JDK, Jackson (to read the keys file, a data file) and Bucket4j;
 * never on HTTP, the tools or the ledger. A secret is never kept, logged or compared except as its
 * SHA-256 digest.
 */
package reckoner.access;
