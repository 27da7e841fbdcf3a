package org.quantrun.core.method;

import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * One ordered sample-identification rule: a regular expression over the sample ID of an
 * injection, the role it gives, and templates that fill in the level (for standards) or the
 * parent sample (for duplicates, spikes and serial dilutions) from capture groups ({@code $1},
 * {@code ${name}}).
 *
 * @param pattern the regular expression (Java syntax), matched against the whole ID
 * @param role the role an ID that matches gets
 * @param level template of the standard level's name (role {@code standard})
 * @param of template of the parent sample's ID (roles duplicate, spike, spike-duplicate,
 *     serial-dilution)
 */
public record IdRule(String pattern, SampleRole role, Optional<String> level, Optional<String> of) {

  /**
   * Checks the pattern compiles.
   *
   * @param pattern the regular expression (Java syntax), matched against the whole ID
   * @param role the role an ID that matches gets
   * @param level template of the standard level's name (role {@code standard})
   * @param of template of the parent sample's ID (roles duplicate, spike, spike-duplicate, serial-dilution)
   * @throws java.util.regex.PatternSyntaxException if the pattern does not compile
   */
  public IdRule {
    Pattern.compile(pattern);
  }

  /**
   * Matches a sample ID against the whole pattern.
   *
   * @param sampleId the ID from the export
   * @return the match when the whole ID matches, else empty
   */
  public Optional<Matcher> match(String sampleId) {
    Matcher m = Pattern.compile(pattern).matcher(sampleId);
    return m.matches() ? Optional.of(m) : Optional.empty();
  }

  /**
   * Fills a template ({@link #level()} or {@link #of()}) from a match of this rule.
   *
   * @param template the template
   * @param match a successful match of {@link #pattern()}
   * @return the template with its group references replaced
   */
  public static String expand(String template, Matcher match) {
    StringBuilder sb = new StringBuilder();
    match.appendReplacement(sb, template);
    return sb.toString();
  }
}
