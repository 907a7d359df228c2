/**
 * The HTTP surface (Javalin 7): routes, content negotiation, bounded body reading, and the one
 * mapping from error codes to RFC 9457 problem details.
 *
 * <p>Design notes: depends on {@code call}, {@code spec} and {@code tool}; nothing depends on it
 * but {@code Main}. Tool families never see this package.
 */
package reckoner.http;
