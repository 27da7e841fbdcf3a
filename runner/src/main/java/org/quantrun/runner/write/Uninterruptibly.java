package org.quantrun.runner.write;

import java.io.IOException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Future;

/** Waiting for work done on another thread of the same results folder. */
final class Uninterruptibly {
  private Uninterruptibly() {}

  /**
   * Waits for a task, even when this thread is interrupted (the interrupt is kept for later), and
   * gives its value or rethrows what it threw.
   *
   * @param <T> the task's value
   * @param task the task
   * @return its value
   * @throws IOException as the task threw it ({@link RuntimeException} and {@link Error} too)
   */
  static <T> T get(Future<T> task) throws IOException {
    boolean interrupted = false;
    try {
      while (true) {
        try {
          return task.get();
        } catch (InterruptedException e) {
          interrupted = true;
        } catch (ExecutionException e) {
          Throwable cause = e.getCause();
          if (cause instanceof IOException io) {
            throw io;
          }
          if (cause instanceof RuntimeException r) {
            throw r;
          }
          if (cause instanceof Error err) {
            throw err;
          }
          throw new IllegalStateException(cause);
        }
      }
    } finally {
      if (interrupted) {
        Thread.currentThread().interrupt();
      }
    }
  }
}
