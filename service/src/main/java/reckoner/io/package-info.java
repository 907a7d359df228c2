/**
 * Small stream utilities shared by the HTTP batch endpoint and the command line: bounded line
 * reading for JSON Lines input.
 *
 * <p>Design notes: depends on the JDK only.
 */
package reckoner.io;
