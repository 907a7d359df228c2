/**
 * Tool specs: reading {@code tool-specs/NAME/VERSION.json}, validating arguments against each
 * version's JSON Schema (draft 2020-12), and assembling the OpenAPI 3.1 document from the specs.
 *
 * <p>Design notes: depends on {@code tool} and on Jackson and the JSON Schema validator. Tool
 * families never see this package; the spec files are data, and they are part of a version.
 */
package reckoner.spec;
