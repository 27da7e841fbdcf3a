package org.quantrun.core.method;

import org.quantrun.core.Token;

/** What happens to an injection that no identification source recognises. */
public enum UnmatchedPolicy implements Token {
  /** It is taken as a real sample (the default). */
  SAMPLE("sample"),
  /** The run is refused with a message naming the injection. */
  REJECT("reject");

  private final String token;

  UnmatchedPolicy(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
