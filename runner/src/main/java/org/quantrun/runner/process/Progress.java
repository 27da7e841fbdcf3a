package org.quantrun.runner.process;

import java.io.PrintWriter;

/**
 * A one-line progress bar on standard error, drawn only on an interactive terminal and only when
 * there is more than one export; otherwise it prints nothing at all.
 */
public final class Progress {
  private static final int WIDTH = 30;
  private final PrintWriter err;
  private final int total;
  private final boolean shown;
  private int done;
  private String current = "";
  private int drawnLength;

  /**
   * A progress bar.
   *
   * @param err where to draw it
   * @param total how many items there are
   * @param interactive whether the output is a terminal ({@code System.console() != null})
   */
  public Progress(PrintWriter err, int total, boolean interactive) {
    this.err = err;
    this.total = total;
    this.shown = interactive && total > 1;
  }

  /**
   * Whether the bar is drawn at all.
   *
   * @return true on a terminal with more than one item
   */
  public boolean shown() {
    return shown;
  }

  /**
   * Starts an item.
   *
   * @param name its name
   */
  public void start(String name) {
    current = name;
    draw();
  }

  /** Marks the current item done. */
  public void step() {
    done++;
    draw();
  }

  /**
   * Prints a line of text above the bar (the bar is cleared and redrawn).
   *
   * @param out where the line goes
   * @param line the line
   */
  public void println(PrintWriter out, String line) {
    clear();
    out.println(line);
    out.flush();
    draw();
  }

  /** Removes the bar at the end. */
  public void finish() {
    clear();
  }

  private void draw() {
    if (!shown) {
      return;
    }
    int filled = total == 0 ? WIDTH : done * WIDTH / total;
    String name = current.length() > 40 ? current.substring(0, 37) + "..." : current;
    String text = "[" + "#".repeat(filled) + "-".repeat(WIDTH - filled) + "] " + done + "/" + total + " " + name;
    err.print("\r" + text + " ".repeat(Math.max(0, drawnLength - text.length())));
    err.flush();
    drawnLength = text.length();
  }

  private void clear() {
    if (shown && drawnLength > 0) {
      err.print("\r" + " ".repeat(drawnLength) + "\r");
      err.flush();
      drawnLength = 0;
    }
  }
}
