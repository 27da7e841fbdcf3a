/**
 * The result of processing a run: immutable records that the writers turn into files. Core makes
 * them; nothing here reads or writes files.
 */
package org.quantrun.core.model;
