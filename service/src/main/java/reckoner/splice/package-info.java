/**
 * Splicing: the markup that marks calls inside text ({@code <:arith(1+1):>}), parsing documents
 * into literal text and calls, and answering calls in place ({@code <:arith(1+1) :: 2:>}).
 *
 * <p>Design notes: depends on {@code call} (to run calls) and {@code tool}; never on HTTP or JSON.
 * Parsing never fails: malformed markup is reported per call and its text is kept.
 */
package reckoner.splice;
