package org.quantrun.core.method;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import java.util.regex.Matcher;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.calibration.CurveModel;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.calibration.Weighting;
import org.quantrun.core.qc.Window;

/** The example methods load into the records their comments describe. */
class ExampleContentTest {

  private static Method load(String name) throws MethodException {
    return MethodLoader.load(Fixtures.read(Fixtures.examples().resolve(name)), name);
  }

  /** Applies the identification rules in order, as the run processor will. */
  private static Optional<String> firstRule(Method m, String sampleId) {
    for (IdRule r : m.identification().rules()) {
      Optional<Matcher> match = r.match(sampleId);
      if (match.isPresent()) {
        String extra = r.level().or(r::of).map(t -> " " + IdRule.expand(t, match.get())).orElse("");
        return Optional.of(r.role().token() + extra);
      }
    }
    return Optional.empty();
  }

  @Test
  @DisplayName("the drinking-water method has 14 weighted analyte lines and mixed standards with gaps")
  void drinkingWater() throws MethodException {
    Method m = load("drinking-water-trace-metals.yaml");
    assertTrue(m.analytes().size() >= 12);
    assertTrue(m.analytes().stream().allMatch(a -> a.weighting() != Weighting.NONE), "every fit weighted");
    assertEquals(CurveModel.QUADRATIC, m.analyte("Zn 213.857").orElseThrow().curve());
    assertEquals(Weighting.INVERSE_X_SQUARED, m.analyte("Pb 220.353").orElseThrow().weighting());
    assertEquals(Optional.empty(), m.level("S1").orElseThrow().concentration("Al"), "Al is absent from S1");
    assertEquals(4, m.levelsOf("Al").size());
    assertEquals(m.level("S3").orElseThrow().concentrations(), m.qc().ccv().standard().trueValues(), "CCV from level S3");
    assertEquals(new Window(95, 105), m.qc().icv().recovery());
    assertEquals(SampleRole.STANDARD, m.identification().typeValues().get("CAL"));
    assertEquals(Optional.of("standard S4"), firstRule(m, "CAL-S4"));
    assertEquals(Optional.of("duplicate DW-2611-0042"), firstRule(m, "DW-2611-0042 D"));
    assertEquals(Optional.of("spike-duplicate DW-2611-0042"), firstRule(m, "DW-2611-0042 SD"));
    assertEquals(Optional.empty(), firstRule(m, "DW-2611-0042"));
    assertEquals(UnmatchedPolicy.REJECT, m.identification().unmatched());
    assertEquals(Optional.of("Dil"), m.dilution().factorColumn());
    assertEquals("EST", m.reporting().qualifier(ResultFlag.ESTIMATED));
    assertEquals("carry-over-suspect", m.reporting().qualifier(ResultFlag.CARRY_OVER_SUSPECT), "unmapped flags keep their name");
    assertTrue(m.qc().ccv().nonDetectsStandAfterHighBias());
  }

  @Test
  @DisplayName("the ICP-MS method has over 20 lines, two isotopes for some elements and a defined internal standard for each")
  void icpms() throws MethodException {
    Method m = load("icpms-water-internal-standards.yaml");
    assertTrue(m.analytes().size() >= 20);
    List<String> pb = m.analytes().stream().filter(a -> a.name().equals("Pb")).map(Analyte::key).toList();
    assertEquals(List.of("Pb 206", "Pb 208"), pb);
    for (Analyte a : m.analytes()) {
      String is = a.internalStandard().orElseThrow();
      assertTrue(m.internalStandard(is).isPresent(), a.key() + " names " + is);
    }
    assertEquals(CalibrationBlankHandling.ZERO_POINT, m.blanks().calibrationBlank());
    assertEquals(FitPoints.READINGS, m.analyte("Ag 107").orElseThrow().fitPoints());
    assertEquals(Optional.of(0.998), m.qc().calibration().minR2());
    assertEquals(Optional.empty(), m.qc().calibration().minR());
    assertEquals(Optional.empty(), m.importSettings().profile());
    assertEquals("3", m.importSettings().settings().get("reading-columns"));
    assertTrue(m.importSettings().detect());
    assertEquals(Optional.of("standard T1"), firstRule(m, "STD-T1"), "named group template");
    assertEquals(Optional.of("spike-duplicate GW-26-0311"), firstRule(m, "GW-26-0311-MSD"));
    assertEquals(List.of("Th"), m.qc().ccv().standard().exempt());
    assertEquals(BelowLodStyle.TEXT, m.reporting().belowLod());
    assertEquals("n.d.", m.reporting().belowLodText());
  }

  @Test
  @DisplayName("the soil method reports mg/kg dry weight through a prep sheet and subtracts method blanks")
  void soil() throws MethodException {
    Method m = load("soil-digest-mg-per-kg.yaml");
    PrepSheetLayout layout = m.dilution().prepSheet().orElseThrow();
    assertEquals(ConcentrationUnit.MG_PER_KG, layout.reportUnit());
    assertEquals(SolidsBasis.DRY_WEIGHT, layout.basis());
    assertEquals("Mass (g)", layout.sampleMassColumn());
    assertEquals(Optional.of("Dry fraction"), layout.solidsFractionColumn());
    assertEquals(MethodBlankHandling.SUBTRACT, m.blanks().methodBlank());
    assertEquals(ConcentrationUnit.MG_PER_L, m.analyte("Fe 238.204").orElseThrow().unit());
    assertEquals(ConcentrationUnit.UG_PER_L, m.analyte("Pb 220.353").orElseThrow().unit());
    assertEquals(List.of(LimitSource.METHOD, LimitSource.CALIBRATION), m.limits().order());
    assertEquals(Optional.of("Level"), m.identification().levelColumn());
    assertEquals(BetweenLodLoqStyle.LESS_THAN_LOQ, m.reporting().betweenLodLoq());
  }

  @Test
  @DisplayName("keys left out take quantrun's conventions where labs differ")
  void defaultsFollowTheConventions() throws MethodException {
    String minimal = String.join("\n",
        "method: {id: M, version: 1, unit: ug/L}",
        "analytes: [{name: Pb}]",
        "standards: [{level: A, concentrations: {Pb: 1}}, {level: B, concentrations: {Pb: 10}}]",
        "identification: {rules: [{pattern: 'STD(.)', role: standard, level: '$1'}, {pattern: BLK, role: calibration-blank},",
        "  {pattern: ICV, role: icv}, {pattern: CCV, role: ccv}]}",
        "qc: {icv: {true-values: {Pb: 5}}, ccv: {from-level: B}}", "");
    Method m = MethodLoader.load(minimal, "minimal.yaml");
    Analyte pb = m.analytes().get(0);
    // common practice: one fit point per injection mean, blank subtracted and not a fit point
    assertEquals(FitPoints.INJECTION_MEANS, pb.fitPoints());
    assertEquals(CurveModel.LINEAR, pb.curve());
    assertEquals(Weighting.NONE, pb.weighting());
    assertEquals(CalibrationBlankHandling.SUBTRACT, m.blanks().calibrationBlank());
    assertEquals(MethodBlankHandling.REPORT_ONLY, m.blanks().methodBlank());
    assertEquals(List.of(LimitSource.METHOD, LimitSource.RUN_BLANKS, LimitSource.CALIBRATION), m.limits().order());
    assertEquals(3, m.limits().minBlankReplicates());
    assertEquals(3.3, m.limits().calibrationLodMultiplier()); // ICH Q2 LOD = 3.3 s / slope, from memory
    assertEquals(10.0, m.limits().calibrationLoqMultiplier()); // ICH Q2 LOQ = 10 s / slope, from memory
    assertEquals(3.0, m.limits().blankLodMultiplier()); // IUPAC-style 3 s_blank, from memory
    assertEquals(RoundingRule.HALF_EVEN, m.reporting().rounding()); // ISO 80000-1 rule B, from memory
    assertEquals(BelowLodStyle.LESS_THAN_LOD, m.reporting().belowLod());
    assertEquals(BetweenLodLoqStyle.VALUE_ESTIMATED, m.reporting().betweenLodLoq());
    assertEquals(Optional.of(0.995), m.qc().calibration().minR()); // common acceptance r >= 0.995, from memory
    assertEquals(new Window(90, 110), m.qc().ccv().standard().recovery()); // EPA 200.7/200.8 CCV 90-110 %, from memory
    assertEquals(new Window(60, 125), m.qc().internalStandardRecovery()); // EPA 200.8 IS window 60-125 %, from memory
    assertEquals(4.0, m.qc().spike().map(SpikeRule::maxBackgroundRatio).orElse(MethodDefaults.SPIKE_MAX_BACKGROUND_RATIO));
    assertEquals(new PairRule(20, 5, 1), m.qc().duplicate()); // RPD <= 20 % from 5x RL, else |a-b| <= RL, from memory
    assertEquals(10, m.qc().ccv().frequency()); // CCV every 10 samples, EPA 200.7, from memory
    assertEquals(1.0, m.dilution().defaultFactor());
    assertEquals(ImportSettings.AUTO, m.importSettings().importer());
    assertEquals(Optional.empty(), m.qc().lcs());
  }

  @Test
  @DisplayName("a default acceptance limit can be overridden by the method")
  void defaultsAreOverridable() throws MethodException {
    String text = String.join("\n",
        "method: {id: M, version: 1, unit: ug/L}",
        "analytes: [{name: Pb}]",
        "standards: [{level: A, concentrations: {Pb: 1}}, {level: B, concentrations: {Pb: 10}}]",
        "identification: {type-column: T, type-values: {STD: standard, B: calibration-blank, I: icv, C: ccv}, level-column: L}",
        "qc: {icv: {exempt: [Pb]}, ccv: {from-level: B, recovery: {low: 85, high: 115}},",
        "     internal-standard: {recovery: {low: 30, high: 120}}, calibration: {min-r: 0.998}}", "");
    Method m = MethodLoader.load(text, "override.yaml");
    assertEquals(new Window(85, 115), m.qc().ccv().standard().recovery());
    assertEquals(new Window(30, 120), m.qc().internalStandardRecovery()); // EPA 6020A IS window 30-120 %, from memory
    assertEquals(Optional.of(0.998), m.qc().calibration().minR()); // SW-846 6010D r >= 0.998, from memory
    assertEquals(List.of("Pb"), m.qc().icv().exempt());
  }
}
