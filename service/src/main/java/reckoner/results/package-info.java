/**
 * The JSON shapes of call results that the HTTP API and the offline command line share: one call's
 * result (invoke, batch lines, splice) and a filled document (fill), so the two give the same bytes
 * for the same calls.
 *
 * <p>Design notes: depends on {@code call}, {@code splice}, {@code tool} and Jackson; never on HTTP.
 */
package reckoner.results;
