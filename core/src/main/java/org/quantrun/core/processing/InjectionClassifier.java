package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.IdRule;
import org.quantrun.core.method.Identification;
import org.quantrun.core.method.IdentificationOrder;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.method.UnmatchedPolicy;

/**
 * Gives every injection its role by the method's identification rules: the exported type column
 * named by {@code identification.type-column} (through the method's value map) and the ordered ID rules (the first whose pattern matches the
 * whole sample ID). When both give a role, the method's order decides; the other still supplies a
 * standard's level or a duplicate's parent. A standard's level comes from the export's level column
 * ({@code identification.level-column}) when its cell is not blank (a rule's level must then agree),
 * else from the rule; a standard whose level neither gives is looked up by its sample ID among the
 * level names.
 */
final class InjectionClassifier {
  private InjectionClassifier() {}

  static List<Classified> classify(RawRun run, Method method) {
    Identification id = method.identification();
    List<Classified> out = new ArrayList<>(run.injections().size());
    List<String> unmatched = new ArrayList<>();
    List<Injection> injections = run.injections();
    List<Pattern> patterns = id.rules().stream().map(r -> Pattern.compile(r.pattern())).toList();
    for (int i = 0; i < injections.size(); i++) {
      Injection inj = injections.get(i);
      Optional<String> type = InjectionColumns.type(run, inj, id.typeColumn());
      Optional<SampleRole> byType = type.flatMap(t -> typeRole(id.typeValues(), t));
      Optional<RuleMatch> byRule = firstRule(id.rules(), patterns, inj.sampleId());
      SampleRole role;
      String how;
      boolean typeFirst = id.order() == IdentificationOrder.TYPE_COLUMN_FIRST;
      if (byType.isPresent() && (typeFirst || byRule.isEmpty())) {
        role = byType.get();
        how = "type column '" + type.get() + "'";
      } else if (byRule.isPresent()) {
        role = byRule.get().rule().role();
        how = "rule " + byRule.get().number() + " '" + byRule.get().rule().pattern() + "'";
      } else if (id.unmatched() == UnmatchedPolicy.SAMPLE) {
        role = SampleRole.SAMPLE;
        how = "no rule matched: taken as a sample";
      } else {
        unmatched.add(inj.sequence() + " '" + inj.sampleId() + "'");
        continue;
      }
      Optional<String> level = Optional.empty();
      Optional<String> parent = Optional.empty();
      if (byRule.isPresent() && byRule.get().rule().role() == role) {
        IdRule r = byRule.get().rule();
        Matcher m = byRule.get().matcher();
        level = r.level().map(t -> IdRule.expand(t, m));
        parent = r.of().map(t -> IdRule.expand(t, m));
      }
      if (role == SampleRole.STANDARD) {
        Optional<String> column = id.levelColumn();
        Optional<String> fromColumn = column.isPresent()
            ? InjectionColumns.level(run, inj, method, column.get()) : Optional.empty();
        if (fromColumn.isPresent()) {
          if (level.isPresent() && !level.get().equals(fromColumn.get())) {
            throw new ProcessingException(run.sourceName() + ": injection " + inj.sequence() + " '" + inj.sampleId()
                + "' is standard level '" + fromColumn.get() + "' by the export's '" + column.get() + "' column ("
                + InjectionColumns.LEVEL_KEY + "), but rule " + byRule.get().number() + " '" + byRule.get().rule().pattern()
                + "' gives level '" + level.get() + "' (make the rule and the column agree, or drop the rule's level)");
          }
          level = fromColumn;
          how = how + ", level from the export's '" + column.get() + "' column";
        }
        if (level.isEmpty() && method.level(inj.sampleId()).isPresent()) {
          level = Optional.of(inj.sampleId());
        }
        if (level.isEmpty()) {
          throw new ProcessingException(run.sourceName() + ": injection " + inj.sequence() + " '" + inj.sampleId()
              + "' is a standard (" + how + "), but no rule gives its level and no level is named '"
              + inj.sampleId() + "' (" + column.map(c -> "fill in its '" + c + "' column, or add").orElse("add")
              + " a level template to the standard rule)");
        }
        String name = level.get();
        if (method.level(name).isEmpty()) {
          throw new ProcessingException(run.sourceName() + ": injection " + inj.sequence() + " '" + inj.sampleId()
              + "' is standard level '" + name + "', which the method does not define (expected one of: "
              + String.join(", ", method.standards().stream().map(l -> l.name()).toList()) + ")");
        }
      }
      out.add(new Classified(i, inj, role, level, parent, how));
    }
    if (!unmatched.isEmpty()) {
      throw new ProcessingException(run.sourceName() + ": " + unmatched.size() + " injection"
          + (unmatched.size() > 1 ? "s match" : " matches") + " no identification rule and the method rejects those: "
          + String.join(", ", unmatched.subList(0, Math.min(5, unmatched.size())))
          + (unmatched.size() > 5 ? ", ..." : "")
          + " (add a rule, or set identification.unmatched: sample)");
    }
    return out;
  }

  private record RuleMatch(int number, IdRule rule, Matcher matcher) {}

  private static Optional<RuleMatch> firstRule(List<IdRule> rules, List<Pattern> patterns, String sampleId) {
    for (int i = 0; i < rules.size(); i++) {
      Matcher m = patterns.get(i).matcher(sampleId);
      if (m.matches()) {
        return Optional.of(new RuleMatch(i + 1, rules.get(i), m));
      }
    }
    return Optional.empty();
  }

  private static Optional<SampleRole> typeRole(Map<String, SampleRole> values, String type) {
    SampleRole exact = values.get(type);
    if (exact != null) {
      return Optional.of(exact);
    }
    String t = type.trim().toLowerCase(Locale.ROOT);
    return values.entrySet().stream()
        .filter(e -> e.getKey().trim().toLowerCase(Locale.ROOT).equals(t))
        .map(Map.Entry::getValue).findFirst();
  }
}
