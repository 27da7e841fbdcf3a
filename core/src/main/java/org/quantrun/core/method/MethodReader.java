package org.quantrun.core.method;

import static org.quantrun.core.method.ConcentrationUnit.Dimension.PER_MASS;
import static org.quantrun.core.method.ConcentrationUnit.Dimension.PER_VOLUME;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.regex.PatternSyntaxException;
import org.quantrun.core.calibration.CurveModel;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.calibration.Weighting;
import org.quantrun.core.method.YamlMap.Bound;
import org.quantrun.core.qc.Window;
import org.yaml.snakeyaml.nodes.Node;

/**
 * Walks the composed YAML tree of a method file into {@link Method} records, reporting every
 * problem (structure first, then the checks between sections) into one {@link Problems}.
 */
final class MethodReader {

  static final List<String> TOP = List.of(
      "method", "import", "analytes", "internal-standards", "standards", "blanks", "identification", "dilution",
      "limits", "qc", "reporting");
  static final List<String> METHOD = List.of("id", "version", "description", "unit");
  static final List<String> IMPORT = List.of("importer", "profile", "settings");
  static final List<String> ANALYTE = List.of(
      "name", "line", "mass", "unit", "curve", "weighting", "fit-points", "internal-standard", "mdl", "reporting-limit",
      "working-range", "report");
  static final List<String> RANGE = List.of("low", "high");
  static final List<String> INTERNAL_STANDARD = List.of("name", "element", "line", "mass");
  static final List<String> LEVEL = List.of("level", "concentrations");
  static final List<String> BLANKS = List.of("calibration-blank", "method-blank");
  static final List<String> IDENTIFICATION = List.of("order", "type-column", "type-values", "level-column", "rules", "unmatched");
  static final List<String> RULE = List.of("pattern", "role", "level", "of");
  static final List<String> DILUTION = List.of("default-factor", "factor-column", "prep-sheet");
  static final List<String> PREP = List.of("columns", "report-unit", "basis");
  static final List<String> PREP_COLUMNS = List.of(
      "sample-id", "prep-batch", "dilution-factor", "sample-mass", "final-volume", "solids-fraction");
  static final List<String> LIMITS = List.of(
      "order", "min-blank-replicates", "blank-lod-multiplier", "blank-loq-multiplier", "calibration-lod-multiplier",
      "calibration-loq-multiplier");
  static final List<String> QC = List.of(
      "calibration", "icv", "ccv", "low-check", "blanks", "lcs", "duplicate", "matrix-spike", "serial-dilution",
      "internal-standard", "replicates");
  static final List<String> CALIBRATION = List.of(
      "min-r", "min-r2", "max-back-calc-error", "max-back-calc-error-lowest", "over-range-tolerance");
  static final List<String> CHECK = List.of("true-values", "from-level", "exempt", "recovery");
  static final List<String> CCV = List.of(
      "true-values", "from-level", "exempt", "recovery", "frequency", "non-detects-stand-after-high-bias");
  static final List<String> QC_BLANKS = List.of("calibration-blank-fraction", "method-blank-fraction");
  static final List<String> PAIR = List.of("max-rpd", "min-multiple-of-rl", "low-level-max-difference");
  static final List<String> SPIKE = List.of("added", "exempt", "recovery", "max-background-ratio", "duplicate");
  static final List<String> SERIAL = List.of("factor", "max-difference", "min-multiple-of-rl");
  static final List<String> IS_QC = List.of("recovery");
  static final List<String> REPLICATES = List.of("max-rsd", "min-multiple-of-rl");
  static final List<String> REPORTING = List.of(
      "significant-figures", "rounding", "below-lod", "below-lod-text", "between-lod-loq", "qualifiers");

  /**
   * The keys each fixed-key mapping accepts, by key path ({@code []} marks the items of a list).
   * Mappings of free keys (analyte names, settings, type values) are not listed.
   */
  static final Map<String, List<String>> KEYS = Map.ofEntries(
      Map.entry("", TOP), Map.entry("method", METHOD), Map.entry("import", IMPORT),
      Map.entry("analytes[]", ANALYTE), Map.entry("analytes[].working-range", RANGE),
      Map.entry("internal-standards[]", INTERNAL_STANDARD), Map.entry("standards[]", LEVEL),
      Map.entry("blanks", BLANKS), Map.entry("identification", IDENTIFICATION), Map.entry("identification.rules[]", RULE),
      Map.entry("dilution", DILUTION), Map.entry("dilution.prep-sheet", PREP), Map.entry("dilution.prep-sheet.columns", PREP_COLUMNS),
      Map.entry("limits", LIMITS), Map.entry("qc", QC), Map.entry("qc.calibration", CALIBRATION),
      Map.entry("qc.icv", CHECK), Map.entry("qc.icv.recovery", RANGE), Map.entry("qc.ccv", CCV), Map.entry("qc.ccv.recovery", RANGE),
      Map.entry("qc.low-check", CHECK), Map.entry("qc.low-check.recovery", RANGE), Map.entry("qc.blanks", QC_BLANKS),
      Map.entry("qc.lcs", CHECK), Map.entry("qc.lcs.recovery", RANGE), Map.entry("qc.duplicate", PAIR),
      Map.entry("qc.matrix-spike", SPIKE), Map.entry("qc.matrix-spike.recovery", RANGE), Map.entry("qc.matrix-spike.duplicate", PAIR),
      Map.entry("qc.serial-dilution", SERIAL), Map.entry("qc.internal-standard", IS_QC),
      Map.entry("qc.internal-standard.recovery", RANGE), Map.entry("qc.replicates", REPLICATES), Map.entry("reporting", REPORTING),
      Map.entry("reporting.qualifiers", java.util.Arrays.stream(ResultFlag.values()).map(ResultFlag::token).toList()));

  private static final Bound PERCENT = new Bound(0.0, false, null, false);
  private static final Pattern IMPORTER_ID = Pattern.compile("[a-z0-9][a-z0-9.-]*");
  private static final Pattern GROUP_REF = Pattern.compile("\\$(\\d+|\\{([A-Za-z][A-Za-z0-9]*)\\})");
  private static final Pattern NAMED_GROUP = Pattern.compile("\\(\\?<([A-Za-z][A-Za-z0-9]*)>");

  private final Problems p;
  private final Set<SampleRole> statedRuleRoles = java.util.EnumSet.noneOf(SampleRole.class);

  MethodReader(Problems problems) {
    this.p = problems;
  }

  /** Reads the whole method; the result is meaningful only when no problem was recorded. */
  Optional<Method> read(Node root) {
    Optional<YamlMap> top = YamlMap.of(root, "", p, TOP);
    if (top.isEmpty()) {
      return Optional.empty();
    }
    YamlMap t = top.get();
    for (String required : List.of("method", "analytes", "standards", "identification", "qc")) {
      if (!t.has(required)) {
        t.missing(required, "a '" + required + "' section");
      }
    }
    MethodIdentity identity = identity(t);
    ImportSettings imp = importSettings(t);
    List<InternalStandard> iss = internalStandards(t);
    List<Analyte> analytes = analytes(t, identity.defaultUnit(), iss);
    List<StandardLevel> levels = standards(t, analytes);
    BlankPolicy blanks = blanks(t);
    Identification id = identification(t, levels);
    DilutionScheme dilution = dilution(t);
    LimitPolicy limits = limits(t, analytes);
    QcPlan qc = qc(t, analytes, levels);
    ReportingRules reporting = reporting(t);
    checkCalibrations(analytes, levels, blanks);
    if (t.has("identification")) {
      checkIdentifiable(id, blanks);
    }
    if (!p.isEmpty()) {
      return Optional.empty();
    }
    return Optional.of(new Method(identity, imp, analytes, iss, levels, blanks, id, dilution, limits, qc, reporting));
  }

  // ---- identity and import ----

  private MethodIdentity identity(YamlMap t) {
    Optional<YamlMap> m = t.map("method", METHOD);
    if (m.isEmpty()) {
      return new MethodIdentity("", "", "", ConcentrationUnit.UG_PER_L);
    }
    String id = m.get().requiredText("id", "the lab's identifier of the method");
    String version = m.get().requiredText("version", "the method's version");
    String description = m.get().text("description").orElse("");
    ConcentrationUnit unit = ConcentrationUnit.UG_PER_L;
    if (!m.get().has("unit")) {
      m.get().missing("unit", "the default concentration unit, e.g. ug/L");
    } else {
      unit = m.get().unit("unit", PER_VOLUME).orElse(unit);
    }
    return new MethodIdentity(id, version, description, unit);
  }

  private ImportSettings importSettings(YamlMap t) {
    Optional<YamlMap> m = t.map("import", IMPORT);
    if (m.isEmpty()) {
      return new ImportSettings(ImportSettings.AUTO, Optional.empty(), Map.of());
    }
    String importer = m.get().text("importer").orElse(ImportSettings.AUTO);
    if (!IMPORTER_ID.matcher(importer).matches()) {
      p.at("import.importer", "'" + importer + "' is not an importer id", "auto, or lower-case letters, digits, '.' and '-'");
    }
    Optional<String> profile = m.get().text("profile");
    profile.ifPresent(f -> {
      if (f.startsWith("/") || f.startsWith("\\") || f.matches("^[A-Za-z]:.*") || f.startsWith("~")) {
        p.at("import.profile", "'" + f + "' is an absolute path", "a path relative to the method file");
      }
    });
    Map<String, String> settings = new LinkedHashMap<>();
    m.get().map("settings", null).ifPresent(s -> {
      for (String k : s.keys()) {
        YamlMap.scalar(s.node(k).orElseThrow(), s.join(k), "a single value (text, number or true/false)", p)
            .ifPresent(v -> settings.put(k, v.getValue()));
      }
    });
    return new ImportSettings(importer, profile, settings);
  }

  // ---- analytes, internal standards, standards ----

  private List<InternalStandard> internalStandards(YamlMap t) {
    List<InternalStandard> out = new ArrayList<>();
    Set<String> names = new LinkedHashSet<>();
    for (YamlMap m : t.maps("internal-standards", INTERNAL_STANDARD)) {
      String path = m.path();
      String name = m.requiredText("name", "a name analytes refer to, e.g. In115");
      String element = m.text("element").orElse(name);
      Optional<String> line = m.text("line");
      Optional<Integer> mass = m.integer("mass", 1, 300);
      if (line.isPresent() && mass.isPresent()) {
        p.at(path + ".mass", "an internal standard has a line or a mass, not both", "only one of line, mass");
      }
      if (!name.isEmpty() && !names.add(name)) {
        p.at(path + ".name", "internal standard '" + name + "' is defined twice", "unique names");
      }
      out.add(new InternalStandard(name, element, line, mass));
    }
    return out;
  }

  private List<Analyte> analytes(YamlMap t, ConcentrationUnit defaultUnit, List<InternalStandard> iss) {
    List<Analyte> out = new ArrayList<>();
    List<YamlMap> items = t.maps("analytes", ANALYTE);
    if (isEmptyList(t, "analytes")) {
      p.at("analytes", "the method has no analytes", "at least one analyte");
    }
    Set<String> keys = new LinkedHashSet<>();
    List<String> isNames = iss.stream().map(InternalStandard::name).toList();
    for (YamlMap m : items) {
      String path = m.path();
      String name = m.requiredText("name", "the analyte, e.g. Pb");
      Optional<String> line = m.text("line");
      Optional<Integer> mass = m.integer("mass", 1, 300);
      if (m.has("line") && m.has("mass")) {
        p.at(path + ".mass", "an analyte line has a line or a mass, not both", "only one of line, mass");
      }
      ConcentrationUnit unit = m.has("unit") ? m.unit("unit", PER_VOLUME).orElse(defaultUnit) : defaultUnit;
      CurveModel curve = m.token("curve", CurveModel.class, MethodDefaults.CURVE);
      Weighting weighting = m.token("weighting", Weighting.class, MethodDefaults.WEIGHTING);
      FitPoints fit = m.token("fit-points", FitPoints.class, MethodDefaults.FIT_POINTS);
      Optional<String> is = m.text("internal-standard");
      is.ifPresent(s -> {
        if (!isNames.contains(s)) {
          String near = Suggestions.closest(s, isNames).map(n -> ", did you mean '" + n + "'?").orElse("");
          p.at(path + ".internal-standard", "internal standard '" + s + "' is not defined" + near,
              isNames.isEmpty() ? "an entry in internal-standards" : "one of: " + String.join(", ", isNames));
        }
      });
      Optional<Double> mdl = m.number("mdl", Bound.POSITIVE);
      Optional<Double> rl = m.number("reporting-limit", Bound.POSITIVE);
      if (mdl.isPresent() && rl.isPresent() && mdl.get() > rl.get()) {
        p.at(path + ".mdl", "mdl " + mdl.get() + " is above the reporting limit " + rl.get(), "mdl <= reporting-limit");
      }
      Optional<WorkingRange> range = m.map("working-range", RANGE).flatMap(r -> {
        Optional<Double> lo = r.number("low", Bound.NOT_NEGATIVE);
        Optional<Double> hi = r.number("high", Bound.POSITIVE);
        if (!r.has("low") || !r.has("high")) {
          r.missing(r.has("low") ? "high" : "low", "both low and high");
          return Optional.empty();
        }
        if (lo.isPresent() && hi.isPresent()) {
          if (lo.get() >= hi.get()) {
            p.at(r.join("high"), "high " + hi.get() + " is not above low " + lo.get(), "low < high");
            return Optional.empty();
          }
          return Optional.of(new WorkingRange(lo.get(), hi.get()));
        }
        return Optional.empty();
      });
      boolean report = m.bool("report", false);
      Analyte a = new Analyte(name, line, mass, unit, curve, weighting, fit, is, mdl, rl, range, report);
      if (!name.isEmpty() && !keys.add(a.key())) {
        p.at(path + ".name", "analyte line '" + a.key() + "' is defined twice", "each name + line/mass once");
      }
      out.add(a);
    }
    Map<String, List<Analyte>> reported = new LinkedHashMap<>();
    for (int i = 0; i < out.size(); i++) {
      if (out.get(i).report()) {
        reported.computeIfAbsent(out.get(i).name(), k -> new ArrayList<>()).add(out.get(i));
      }
    }
    for (int i = 0; i < out.size(); i++) {
      Analyte a = out.get(i);
      List<Analyte> r = reported.getOrDefault(a.name(), List.of());
      if (r.size() > 1 && a == r.get(1)) {
        p.at(items.get(i).path() + ".report", "analyte " + a.name() + " has " + r.size() + " lines marked report: "
            + r.stream().map(Analyte::key).collect(java.util.stream.Collectors.joining(", ")),
            "report: true on one line of an analyte at most");
      }
    }
    return out;
  }

  private List<StandardLevel> standards(YamlMap t, List<Analyte> analytes) {
    List<StandardLevel> out = new ArrayList<>();
    List<String> names = analyteNames(analytes);
    Set<String> levelNames = new LinkedHashSet<>();
    List<YamlMap> items = t.maps("standards", LEVEL);
    if (isEmptyList(t, "standards")) {
      p.at("standards", "the method has no standard levels", "at least one level");
    }
    for (YamlMap m : items) {
      String path = m.path();
      String name = m.requiredText("level", "the level's name, e.g. S1");
      if (!name.isEmpty() && !levelNames.add(name)) {
        p.at(path + ".level", "level '" + name + "' is defined twice", "unique level names");
      }
      if (!m.has("concentrations")) {
        m.missing("concentrations", "analyte name to concentration");
      }
      Map<String, Double> conc = m.numberMap("concentrations", Bound.POSITIVE);
      if (m.node("concentrations").map(n -> n instanceof org.yaml.snakeyaml.nodes.MappingNode mn && mn.getValue().isEmpty()).orElse(false)) {
        p.at(path + ".concentrations", "level '" + name + "' has no concentrations", "at least one analyte name with its concentration");
      }
      checkNames(conc.keySet(), names, path + ".concentrations", "analyte");
      out.add(new StandardLevel(name, conc));
    }
    return out;
  }

  private static boolean isEmptyList(YamlMap t, String key) {
    return t.node(key).map(n -> n instanceof org.yaml.snakeyaml.nodes.SequenceNode seq && seq.getValue().isEmpty()).orElse(false);
  }

  private void checkNames(Iterable<String> used, List<String> known, String path, String what) {
    for (String u : used) {
      if (!known.contains(u)) {
        String near = Suggestions.closest(u, known).map(n -> ", did you mean '" + n + "'?").orElse("");
        p.at(path + "." + u, "'" + u + "' is not an " + what + " of this method" + near, "one of: " + String.join(", ", known));
      }
    }
  }

  private static List<String> analyteNames(List<Analyte> analytes) {
    return analytes.stream().map(Analyte::name).filter(n -> !n.isEmpty()).distinct().toList();
  }

  // ---- blanks, identification, dilution ----

  private BlankPolicy blanks(YamlMap t) {
    Optional<YamlMap> m = t.map("blanks", BLANKS);
    return new BlankPolicy(
        m.map(b -> b.token("calibration-blank", CalibrationBlankHandling.class, MethodDefaults.CALIBRATION_BLANK))
            .orElse(MethodDefaults.CALIBRATION_BLANK),
        m.map(b -> b.token("method-blank", MethodBlankHandling.class, MethodDefaults.METHOD_BLANK))
            .orElse(MethodDefaults.METHOD_BLANK));
  }

  private Identification identification(YamlMap t, List<StandardLevel> levels) {
    Optional<YamlMap> mm = t.map("identification", IDENTIFICATION);
    if (mm.isEmpty()) {
      return new Identification(Optional.empty(), Map.of(), Optional.empty(), List.of(), IdentificationOrder.RULES_FIRST,
          UnmatchedPolicy.SAMPLE);
    }
    YamlMap m = mm.get();
    Optional<String> typeColumn = m.text("type-column");
    Map<String, SampleRole> typeValues = new LinkedHashMap<>();
    m.map("type-values", null).ifPresent(v -> {
      for (String k : v.keys()) {
        YamlMap.token(v.node(k).orElseThrow(), v.join(k), SampleRole.class, p).ifPresent(r -> typeValues.put(k, r));
      }
    });
    if (typeColumn.isPresent() != m.has("type-values")) {
      p.at(typeColumn.isPresent() ? "identification.type-column" : "identification.type-values",
          "type-column and type-values go together", "both or neither");
    }
    Optional<String> levelColumn = m.text("level-column");
    List<String> levelNames = levels.stream().map(StandardLevel::name).toList();
    List<IdRule> rules = new ArrayList<>();
    for (YamlMap r : m.maps("rules", RULE)) {
      rule(r, r.path(), levelColumn.isPresent(), levelNames).ifPresent(rules::add);
    }
    if (typeColumn.isEmpty() && !m.has("rules")) {
      p.at("identification", "no way to identify injections is given", "type-column with type-values, or rules");
    }
    return new Identification(typeColumn, typeValues, levelColumn, rules,
        m.token("order", IdentificationOrder.class, IdentificationOrder.RULES_FIRST),
        m.token("unmatched", UnmatchedPolicy.class, UnmatchedPolicy.SAMPLE));
  }

  private Optional<IdRule> rule(YamlMap r, String path, boolean levelColumn, List<String> levelNames) {
    String regex = r.requiredText("pattern", "a regular expression over the sample ID");
    if (!r.has("role")) {
      r.missing("role", "the role the rule gives");
    }
    Optional<SampleRole> role = r.token("role", SampleRole.class);
    Optional<String> level = r.text("level");
    Optional<String> of = r.text("of");
    int groups = -1;
    Set<String> named = new LinkedHashSet<>();
    if (!regex.isEmpty()) {
      try {
        groups = Pattern.compile(regex).matcher("").groupCount();
        Matcher ng = NAMED_GROUP.matcher(regex);
        while (ng.find()) {
          named.add(ng.group(1));
        }
      } catch (PatternSyntaxException e) {
        p.at(path + ".pattern", "pattern does not compile: " + e.getDescription() + " near index " + e.getIndex(),
            "a Java regular expression");
      }
    }
    if (role.isEmpty()) {
      return Optional.empty();
    }
    statedRuleRoles.add(role.get());
    boolean needsParent = Set.of(SampleRole.DUPLICATE, SampleRole.SPIKE, SampleRole.SPIKE_DUPLICATE, SampleRole.SERIAL_DILUTION)
        .contains(role.get());
    if (needsParent && of.isEmpty()) {
      r.missing("of", "a template of the parent sample's ID, e.g. $1");
    }
    if (!needsParent && r.has("of")) {
      p.at(path + ".of", "only duplicate, spike, spike-duplicate and serial-dilution rules name a parent", "no 'of' here");
    }
    if (role.get() == SampleRole.STANDARD && level.isEmpty() && !levelColumn && !r.has("level")) {
      r.missing("level", "a template of the level name, e.g. S$1 (or identification.level-column)");
    }
    if (role.get() != SampleRole.STANDARD && r.has("level")) {
      p.at(path + ".level", "only standard rules name a level", "no 'level' here");
    }
    for (String key : List.of("level", "of")) {
      Optional<String> tpl = r.text(key);
      if (tpl.isEmpty() || groups < 0) {
        continue;
      }
      String rest = GROUP_REF.matcher(tpl.get().replaceAll("\\\\.", "")).replaceAll("");
      if (rest.contains("$") || rest.contains("\\")) {
        p.at(path + "." + key, "template '" + tpl.get() + "' has a '$' or '\\' that is not a group reference",
            "$1 or ${name} for a group, \\$ for a literal $");
        continue;
      }
      Matcher ref = GROUP_REF.matcher(tpl.get());
      boolean any = false;
      while (ref.find()) {
        any = true;
        if (ref.group(2) != null ? !named.contains(ref.group(2)) : Integer.parseInt(ref.group(1)) > groups) {
          p.at(path + "." + key, "template refers to group " + ref.group() + " that the pattern does not have",
              "a group of the pattern (it has " + groups + ")");
        }
      }
      if (key.equals("level") && !any && !levelNames.contains(tpl.get())) {
        p.at(path + ".level", "level '" + tpl.get() + "' is not a standard level", "one of: " + String.join(", ", levelNames));
      }
    }
    if (!p.isEmpty() && (regex.isEmpty() || groups < 0)) {
      return Optional.empty();
    }
    return Optional.of(new IdRule(regex, role.get(), level, of));
  }

  private DilutionScheme dilution(YamlMap t) {
    Optional<YamlMap> mm = t.map("dilution", DILUTION);
    if (mm.isEmpty()) {
      return new DilutionScheme(MethodDefaults.DILUTION_FACTOR, Optional.empty(), Optional.empty());
    }
    YamlMap m = mm.get();
    double factor = m.number("default-factor", MethodDefaults.DILUTION_FACTOR, Bound.AT_LEAST_ONE);
    Optional<String> column = m.text("factor-column");
    Optional<PrepSheetLayout> prep = m.map("prep-sheet", PREP).map(ps -> {
      Optional<YamlMap> cols = ps.map("columns", PREP_COLUMNS);
      if (!ps.has("columns")) {
        ps.missing("columns", "the prep sheet's column names");
      }
      String[] c = new String[5];
      List<String> required = PREP_COLUMNS.subList(0, 5);
      for (int i = 0; i < 5; i++) {
        int k = i;
        c[i] = cols.map(x -> x.requiredText(required.get(k), "the name of the prep sheet's " + required.get(k) + " column")).orElse("");
      }
      Optional<String> solids = cols.flatMap(x -> x.text("solids-fraction"));
      ConcentrationUnit unit = ConcentrationUnit.MG_PER_KG;
      if (!ps.has("report-unit")) {
        ps.missing("report-unit", "a per-mass unit, e.g. mg/kg");
      } else {
        unit = ps.unit("report-unit", PER_MASS).orElse(unit);
      }
      SolidsBasis basis = ps.token("basis", SolidsBasis.class, SolidsBasis.AS_RECEIVED);
      if (basis == SolidsBasis.DRY_WEIGHT && solids.isEmpty()) {
        p.at(ps.join("basis"), "dry-weight results need the solids fraction", "prep-sheet.columns.solids-fraction");
      }
      return new PrepSheetLayout(c[0], c[1], c[2], c[3], c[4], solids, unit, basis);
    });
    return new DilutionScheme(factor, column, prep);
  }

  // ---- limits ----

  private LimitPolicy limits(YamlMap t, List<Analyte> analytes) {
    Optional<YamlMap> mm = t.map("limits", LIMITS);
    List<LimitSource> order = new ArrayList<>(MethodDefaults.LIMIT_ORDER);
    if (mm.isPresent() && mm.get().has("order")) {
      order.clear();
      List<Node> items = mm.get().list("order");
      for (int i = 0; i < items.size(); i++) {
        String path = "limits.order[" + i + "]";
        YamlMap.token(items.get(i), path, LimitSource.class, p).ifPresent(s -> {
          if (order.contains(s)) {
            p.at(path, "'" + s.token() + "' is listed twice", "each source once");
          } else {
            order.add(s);
          }
        });
      }
      if (items.isEmpty()) {
        p.at("limits.order", "no limit source is listed", "one or more of: method, run-blanks, calibration");
      }
    }
    if (order.equals(List.of(LimitSource.METHOD))) {
      for (int i = 0; i < analytes.size(); i++) {
        Analyte a = analytes.get(i);
        if (a.mdl().isEmpty() || a.reportingLimit().isEmpty()) {
          p.at("analytes[" + i + "]", "analyte line '" + a.key() + "' has no mdl and reporting-limit, and limits.order has no other source",
              "mdl and reporting-limit, or run-blanks / calibration in limits.order");
        }
      }
    }
    YamlMap m = mm.orElse(null);
    return new LimitPolicy(order,
        m == null ? MethodDefaults.MIN_BLANK_REPLICATES : m.integer("min-blank-replicates", MethodDefaults.MIN_BLANK_REPLICATES, 2, 1000),
        m == null ? MethodDefaults.BLANK_LOD_MULTIPLIER : m.number("blank-lod-multiplier", MethodDefaults.BLANK_LOD_MULTIPLIER, Bound.POSITIVE),
        m == null ? MethodDefaults.BLANK_LOQ_MULTIPLIER : m.number("blank-loq-multiplier", MethodDefaults.BLANK_LOQ_MULTIPLIER, Bound.POSITIVE),
        m == null ? MethodDefaults.CALIBRATION_LOD_MULTIPLIER
            : m.number("calibration-lod-multiplier", MethodDefaults.CALIBRATION_LOD_MULTIPLIER, Bound.POSITIVE),
        m == null ? MethodDefaults.CALIBRATION_LOQ_MULTIPLIER
            : m.number("calibration-loq-multiplier", MethodDefaults.CALIBRATION_LOQ_MULTIPLIER, Bound.POSITIVE));
  }

  // ---- QC ----

  private QcPlan qc(YamlMap t, List<Analyte> analytes, List<StandardLevel> levels) {
    Optional<YamlMap> mm = t.map("qc", QC);
    YamlMap q = mm.orElse(null);
    List<String> names = analyteNames(analytes);

    Optional<YamlMap> cal = q == null ? Optional.empty() : q.map("calibration", CALIBRATION);
    Optional<Double> minR = cal.flatMap(c -> c.number("min-r", new Bound(0.0, false, 1.0, true)));
    Optional<Double> minR2 = cal.flatMap(c -> c.number("min-r2", new Bound(0.0, false, 1.0, true)));
    if (cal.isPresent() && cal.get().has("min-r") && cal.get().has("min-r2")) {
      p.at("qc.calibration.min-r2", "give min-r or min-r2, not both", "only one of min-r, min-r2");
    }
    if (cal.map(c -> !c.has("min-r") && !c.has("min-r2")).orElse(true)) {
      minR = Optional.of(MethodDefaults.MIN_R);
    }
    CalibrationAcceptance acceptance = new CalibrationAcceptance(minR, minR2,
        cal.map(c -> c.number("max-back-calc-error", MethodDefaults.MAX_BACK_CALC_ERROR, PERCENT)).orElse(MethodDefaults.MAX_BACK_CALC_ERROR),
        cal.map(c -> c.number("max-back-calc-error-lowest", MethodDefaults.MAX_BACK_CALC_ERROR_LOWEST, PERCENT))
            .orElse(MethodDefaults.MAX_BACK_CALC_ERROR_LOWEST),
        cal.map(c -> c.number("over-range-tolerance", MethodDefaults.OVER_RANGE_TOLERANCE, Bound.NOT_NEGATIVE))
            .orElse(MethodDefaults.OVER_RANGE_TOLERANCE));

    CheckStandard icv = required(q, "icv", CHECK, names, levels, MethodDefaults.ICV_RECOVERY);
    Optional<YamlMap> ccvMap = q == null ? Optional.empty() : q.map("ccv", CCV);
    CheckStandard ccvStd = required(q, "ccv", CCV, names, levels, MethodDefaults.CCV_RECOVERY);
    CcvPlan ccv = new CcvPlan(ccvStd,
        ccvMap.map(c -> c.integer("frequency", MethodDefaults.CCV_FREQUENCY, 1, 1000)).orElse(MethodDefaults.CCV_FREQUENCY),
        ccvMap.map(c -> c.bool("non-detects-stand-after-high-bias", MethodDefaults.NON_DETECTS_STAND_AFTER_HIGH_CCV))
            .orElse(MethodDefaults.NON_DETECTS_STAND_AFTER_HIGH_CCV));
    Optional<CheckStandard> low = q == null ? Optional.empty()
        : q.map("low-check", CHECK).map(m -> check(m, names, levels, MethodDefaults.LOW_CHECK_RECOVERY));
    Optional<CheckStandard> lcs = q == null ? Optional.empty()
        : q.map("lcs", CHECK).map(m -> check(m, names, levels, MethodDefaults.LCS_RECOVERY));

    Optional<YamlMap> bl = q == null ? Optional.empty() : q.map("blanks", QC_BLANKS);
    BlankChecks blanks = new BlankChecks(
        bl.map(b -> b.number("calibration-blank-fraction", MethodDefaults.CALIBRATION_BLANK_FRACTION, Bound.POSITIVE))
            .orElse(MethodDefaults.CALIBRATION_BLANK_FRACTION),
        bl.map(b -> b.number("method-blank-fraction", MethodDefaults.METHOD_BLANK_FRACTION, Bound.POSITIVE))
            .orElse(MethodDefaults.METHOD_BLANK_FRACTION));

    PairRule duplicate = q == null ? MethodDefaults.DUPLICATE : q.map("duplicate", PAIR).map(this::pair).orElse(MethodDefaults.DUPLICATE);
    Optional<SpikeRule> spike = q == null ? Optional.empty() : q.map("matrix-spike", SPIKE).map(s -> {
      if (!s.has("added")) {
        s.missing("added", "analyte name to concentration added");
      }
      Map<String, Double> added = s.numberMap("added", Bound.POSITIVE);
      List<String> exempt = s.words("exempt");
      complete(s, "added", added.keySet(), exempt, names);
      return new SpikeRule(added, exempt, window(s, "recovery", MethodDefaults.SPIKE_RECOVERY),
          s.number("max-background-ratio", MethodDefaults.SPIKE_MAX_BACKGROUND_RATIO, Bound.POSITIVE),
          s.map("duplicate", PAIR).map(this::pair).orElse(MethodDefaults.DUPLICATE));
    });
    SerialDilutionRule serial = q == null ? MethodDefaults.SERIAL_DILUTION : q.map("serial-dilution", SERIAL).map(s -> {
      SerialDilutionRule d = MethodDefaults.SERIAL_DILUTION;
      return new SerialDilutionRule(s.number("factor", d.factor(), new Bound(1.0, false, null, false)),
          s.number("max-difference", d.maxDifference(), PERCENT), s.number("min-multiple-of-rl", d.minMultipleOfRl(), Bound.NOT_NEGATIVE));
    }).orElse(MethodDefaults.SERIAL_DILUTION);
    Window isWindow = q == null ? MethodDefaults.INTERNAL_STANDARD_RECOVERY
        : q.map("internal-standard", IS_QC).map(s -> window(s, "recovery", MethodDefaults.INTERNAL_STANDARD_RECOVERY))
            .orElse(MethodDefaults.INTERNAL_STANDARD_RECOVERY);
    ReplicateRule reps = q == null ? MethodDefaults.REPLICATES : q.map("replicates", REPLICATES).map(s -> new ReplicateRule(
        s.number("max-rsd", MethodDefaults.REPLICATES.maxRsd(), PERCENT),
        s.number("min-multiple-of-rl", MethodDefaults.REPLICATES.minMultipleOfRl(), Bound.NOT_NEGATIVE)))
        .orElse(MethodDefaults.REPLICATES);
    return new QcPlan(acceptance, icv, ccv, low, blanks, lcs, duplicate, spike, serial, isWindow, reps);
  }

  private CheckStandard required(YamlMap q, String key, List<String> allowed, List<String> names, List<StandardLevel> levels, Window dflt) {
    Optional<YamlMap> m = q == null ? Optional.empty() : q.map(key, allowed);
    if (q != null && !q.has(key)) {
      q.missing(key, "true values for every analyte (or an exempt list)");
    }
    return m.map(x -> check(x, names, levels, dflt)).orElse(new CheckStandard(Map.of(), List.of(), dflt));
  }

  private CheckStandard check(YamlMap m, List<String> names, List<StandardLevel> levels, Window dflt) {
    Map<String, Double> values = new LinkedHashMap<>();
    if (m.has("true-values") && m.has("from-level")) {
      p.at(m.join("from-level"), "give true-values or from-level, not both", "only one of true-values, from-level");
    }
    Optional<String> from = m.text("from-level");
    boolean badLevel = false;
    if (from.isPresent()) {
      Optional<StandardLevel> level = levels.stream().filter(l -> l.name().equals(from.get())).findFirst();
      if (level.isEmpty()) {
        badLevel = true;
        List<String> ln = levels.stream().map(StandardLevel::name).toList();
        p.at(m.join("from-level"), "level '" + from.get() + "' is not a standard level"
            + Suggestions.closest(from.get(), ln).map(n -> ", did you mean '" + n + "'?").orElse(""), "one of: " + String.join(", ", ln));
      } else {
        values.putAll(level.get().concentrations());
      }
    } else if (!m.has("true-values") && !m.has("exempt")) {
      m.missing("true-values", "true values per analyte, or from-level");
    }
    values.putAll(m.numberMap("true-values", Bound.POSITIVE));
    List<String> exempt = m.words("exempt");
    if (from.isPresent()) {
      exempt.forEach(values::remove); // a level may hold analytes this check leaves out
    }
    if (!badLevel) {
      complete(m, from.isPresent() ? "from-level" : "true-values", values.keySet(), exempt, names);
    }
    return new CheckStandard(values, exempt, window(m, "recovery", dflt));
  }

  /** Every analyte has a value or is exempt; no unknown names; none both. */
  private void complete(YamlMap m, String valuesKey, Set<String> given, List<String> exempt, List<String> names) {
    if (!m.has("from-level")) {
      checkNames(given, names, m.join(valuesKey), "analyte");
    }
    for (int i = 0; i < exempt.size(); i++) {
      String e = exempt.get(i);
      if (!names.contains(e)) {
        p.at(m.join("exempt") + "[" + i + "]", "'" + e + "' is not an analyte of this method"
            + Suggestions.closest(e, names).map(n -> ", did you mean '" + n + "'?").orElse(""), "one of: " + String.join(", ", names));
      } else if (given.contains(e)) {
        p.at(m.join("exempt") + "[" + i + "]", "'" + e + "' has a value and is exempt", "either a value or an exemption");
      }
    }
    List<String> missing = names.stream().filter(n -> !given.contains(n) && !exempt.contains(n)).toList();
    if (!missing.isEmpty()) {
      p.at(m.join(valuesKey), "no value for " + String.join(", ", missing), "a value for every analyte, or the analyte listed in exempt");
    }
  }

  private PairRule pair(YamlMap m) {
    PairRule d = MethodDefaults.DUPLICATE;
    return new PairRule(m.number("max-rpd", d.maxRpd(), PERCENT), m.number("min-multiple-of-rl", d.minMultipleOfRl(), Bound.NOT_NEGATIVE),
        m.number("low-level-max-difference", d.lowLevelMaxDifference(), Bound.POSITIVE));
  }

  private Window window(YamlMap m, String key, Window dflt) {
    Optional<YamlMap> w = m.map(key, RANGE);
    if (w.isEmpty()) {
      return dflt;
    }
    Optional<Double> lo = w.get().number("low", Bound.NOT_NEGATIVE);
    Optional<Double> hi = w.get().number("high", Bound.POSITIVE);
    for (String k : RANGE) {
      if (!w.get().has(k)) {
        w.get().missing(k, "both low and high, in percent");
      }
    }
    if (lo.isPresent() && hi.isPresent()) {
      if (lo.get() >= hi.get()) {
        p.at(w.get().join("high"), "high " + num(hi.get()) + " is not above low " + num(lo.get()), "low < high");
        return dflt;
      }
      return new Window(lo.get(), hi.get());
    }
    return dflt;
  }

  private static String num(double d) {
    return d == Math.rint(d) ? Long.toString((long) d) : Double.toString(d);
  }

  // ---- reporting ----

  private ReportingRules reporting(YamlMap t) {
    Optional<YamlMap> mm = t.map("reporting", REPORTING);
    if (mm.isEmpty()) {
      return new ReportingRules(MethodDefaults.SIGNIFICANT_FIGURES, MethodDefaults.ROUNDING, MethodDefaults.BELOW_LOD, "",
          MethodDefaults.BETWEEN_LOD_LOQ, Map.of());
    }
    YamlMap m = mm.get();
    BelowLodStyle below = m.token("below-lod", BelowLodStyle.class, MethodDefaults.BELOW_LOD);
    String text = m.text("below-lod-text").orElse("");
    if (below == BelowLodStyle.TEXT && !m.has("below-lod-text")) {
      p.at("reporting.below-lod", "below-lod: text needs the text to write", "reporting.below-lod-text");
    }
    if (below != BelowLodStyle.TEXT && m.has("below-lod-text")) {
      p.at("reporting.below-lod-text", "below-lod-text is used only with below-lod: text", "below-lod: text, or no below-lod-text");
    }
    Map<ResultFlag, String> qualifiers = new LinkedHashMap<>();
    m.map("qualifiers", null).ifPresent(q -> {
      List<String> flags = java.util.Arrays.stream(ResultFlag.values()).map(ResultFlag::token).toList();
      for (String k : q.keys()) {
        Optional<ResultFlag> f = java.util.Arrays.stream(ResultFlag.values()).filter(x -> x.token().equals(k)).findFirst();
        if (f.isEmpty()) {
          p.add(q.keyNode(k), q.join(k), "unknown flag '" + k + "'" + Suggestions.closest(k, flags).map(n -> ", did you mean '" + n + "'?").orElse(""),
              "one of: " + String.join(", ", flags));
          continue;
        }
        YamlMap.text(q.node(k).orElseThrow(), q.join(k), p).ifPresent(code -> qualifiers.put(f.get(), code));
      }
    });
    return new ReportingRules(m.integer("significant-figures", MethodDefaults.SIGNIFICANT_FIGURES, 1, 10),
        m.token("rounding", RoundingRule.class, MethodDefaults.ROUNDING), below, text,
        m.token("between-lod-loq", BetweenLodLoqStyle.class, MethodDefaults.BETWEEN_LOD_LOQ), qualifiers);
  }

  // ---- checks across sections ----

  /** The roles the calibration and its checks need can be found, and a standard found by type can get its level. */
  private void checkIdentifiable(Identification id, BlankPolicy blanks) {
    Set<SampleRole> byType = Set.copyOf(id.typeValues().values());
    Set<SampleRole> byRule = statedRuleRoles; // a rule with a broken pattern still states its role
    List<SampleRole> needed = new ArrayList<>(List.of(SampleRole.STANDARD, SampleRole.ICV, SampleRole.CCV));
    if (blanks.calibrationBlank() != CalibrationBlankHandling.NONE) {
      needed.add(0, SampleRole.CALIBRATION_BLANK);
    }
    List<String> missing = needed.stream().filter(r -> !byType.contains(r) && !byRule.contains(r)).map(SampleRole::token).toList();
    if (!missing.isEmpty()) {
      p.at("identification", "nothing identifies the role" + (missing.size() > 1 ? "s " : " ") + String.join(", ", missing),
          "a type-values entry or a rule for each");
    }
    if (byType.contains(SampleRole.STANDARD) && id.levelColumn().isEmpty() && !byRule.contains(SampleRole.STANDARD)) {
      p.at("identification.type-values", "standards found by the type column have no way to get their level",
          "identification.level-column, or a standard rule with a level");
    }
  }

  /** Enough distinct levels for every curve; weighting compatible with the levels and blank handling. */
  private void checkCalibrations(List<Analyte> analytes, List<StandardLevel> levels, BlankPolicy blanks) {
    boolean blankPoint = blanks.calibrationBlank() == CalibrationBlankHandling.ZERO_POINT;
    for (int i = 0; i < analytes.size(); i++) {
      Analyte a = analytes.get(i);
      if (a.name().isEmpty()) {
        continue;
      }
      long distinct = levels.stream().map(l -> l.concentrations().get(a.name())).filter(c -> c != null).distinct().count();
      int points = (int) distinct + (blankPoint ? 1 : 0);
      int needed = switch (a.curve()) {
        case THROUGH_ZERO -> 1;
        case LINEAR -> 2;
        case QUADRATIC -> 3;
      };
      String path = "analytes[" + i + "]";
      if (points < needed) {
        p.at(path + (has(path + ".curve") ? ".curve" : ".name"),
            "curve " + a.curve().token() + " of '" + a.key() + "' needs " + needed + " calibration points but the standards give "
                + points + (blankPoint ? " (blank included)" : " (the subtracted blank is not a point)"),
            needed + " distinct concentrations of " + a.name() + " in standards" + (blankPoint ? " including the blank" : ""));
      }
      String wpath = path + (has(path + ".weighting") ? ".weighting" : ".name");
      if (blankPoint && a.weighting() != Weighting.NONE && a.weighting() != Weighting.INVERSE_VARIANCE) {
        p.at(wpath, "weighting " + a.weighting().token() + " cannot weigh the blank fitted at concentration 0",
            "none or 1/s2, or blanks.calibration-blank: subtract");
      } else if (a.weighting() != Weighting.NONE && distinct < 2) {
        p.at(wpath, "weighting " + a.weighting().token() + " of '" + a.key() + "' needs at least 2 distinct standard concentrations, the standards give "
            + distinct, "weighting: none, or more levels");
      }
    }
  }

  private boolean has(String path) {
    return p.knows(path);
  }
}
