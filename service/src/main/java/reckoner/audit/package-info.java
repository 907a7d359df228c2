/**
 * The reproducibility audit: every recorded call run again on this build, with the reference time
 * and the data version it was recorded with, and each answer that differs, byte for byte, reported
 * by tool version. How a dataset's owner shows, a year later, that its tool answers still hold.
 *
 * <p>Design notes: depends on {@code call}, {@code ledger}, {@code spec} and {@code tool}; never on
 * HTTP. The command line and the admin endpoint both drive {@link Audit}.
 */
package reckoner.audit;
