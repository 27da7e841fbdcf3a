package org.quantrun.runner;

public final class Main {
  public static void main(String[] args) {
    System.out.println("quantrun");
  }
}
