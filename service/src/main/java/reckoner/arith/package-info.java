/**
 * {@code arith}: rounded decimal arithmetic. exp4j supplies the expression grammar (tokenizer and
 * shunting-yard); evaluation is decimal with 34-digit operations, and the transcendental functions
 * are binary64 through {@code StrictMath}.
 *
 * <p>Design notes: depends on {@code reckoner.tool} and exp4j only. {@link reckoner.arith.ArithTool}
 * is the entry; the scanner, evaluator and decimal math are package-private.
 */
package reckoner.arith;
