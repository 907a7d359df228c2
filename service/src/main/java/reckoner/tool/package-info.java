/**
 * The tool contract: {@link reckoner.tool.Tool}, its identity, arguments, answers and errors, and
 * the {@link reckoner.tool.ToolRegistry} that serves versions side by side.
 *
 * <p>Design notes: this package depends on nothing but the JDK. Tool families ({@code arith},
 * {@code dates}, {@code units}, {@code facts}) depend on it and on their own libraries only; they
 * never see JSON, HTTP or the ledger. Bad input is a {@link reckoner.tool.ToolException} carrying a
 * {@link reckoner.tool.ToolError}; the call layer turns it into an outcome at one place.
 */
package reckoner.tool;
