/**
 * Service settings: one name per setting across flags, environment and file, validated at start.
 *
 * <p>Design notes: depends on the JDK only.
 */
package reckoner.config;
