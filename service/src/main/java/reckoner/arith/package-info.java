/**
 * {@code arith}: rounded decimal arithmetic, in two published versions.
 *
 * <p>arith@1 ({@link reckoner.arith.ArithTool}): exp4j supplies the expression grammar (tokenizer
 * and shunting-yard); evaluation is decimal with 34-digit operations, and the transcendental
 * functions are binary64 through {@code StrictMath}. Its answers are frozen; its classes
 * ({@code Scanner}, {@code Evaluator}, {@code DecimalMath}, {@code Functions}) change only in ways
 * that keep every answer.
 *
 * <p>arith@2 ({@link reckoner.arith.ArithToolV2}): {@code PhraseLexer}, {@code PhraseFrame},
 * {@code PhraseParser} and {@code WordPhrases} read a phrase into a {@code Node} tree, which
 * {@code Canonical} prints back as the canonical expression; {@code ExactEvaluator} computes it on
 * {@code Rational}s, or {@code BoundedEvaluator} on intervals when exact values grow too large;
 * {@code RealFunctions} and {@code Roots} hold the functions, the transcendental ones through
 * arith@1's {@code Functions}.
 *
 * <p>Design notes: depends on {@code reckoner.tool} and exp4j only. The two tool classes are the
 * entries; everything else is package-private.
 */
package reckoner.arith;
