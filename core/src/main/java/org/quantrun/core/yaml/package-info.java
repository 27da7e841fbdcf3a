/**
 * Checks shared by the readers of YAML configuration (method files and import profiles) on the
 * composed node tree, beyond what SnakeYAML's own loader limits catch.
 */
package org.quantrun.core.yaml;
