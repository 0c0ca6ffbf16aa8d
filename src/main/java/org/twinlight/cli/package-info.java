/**
 * The command line: picocli commands that parse options, call the library and the report layer,
 * and print. Exit codes: 0 success, 1 the work failed, 2 bad usage or input.
 */
package org.twinlight.cli;
