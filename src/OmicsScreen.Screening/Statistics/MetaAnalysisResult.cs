namespace OmicsScreen.Screening.Statistics;

/// <summary>Inverse-variance fixed-effect and DerSimonian-Laird random-effects pooling of per-study estimates.</summary>
/// <param name="FixedEstimate">sum w_i y_i / sum w_i with w_i = 1 / v_i.</param>
/// <param name="FixedStandardError">1 / sqrt(sum w_i).</param>
/// <param name="Q">Cochran's Q = sum w_i (y_i - FixedEstimate)^2.</param>
/// <param name="DegreesOfFreedom">Number of studies minus one.</param>
/// <param name="QPValue">P(chi^2_df &gt;= Q), the test of homogeneity; NaN with one study.</param>
/// <param name="Tau2">DerSimonian-Laird between-study variance, truncated at 0.</param>
/// <param name="I2">max(0, (Q - df) / Q), the share of variation due to heterogeneity; NaN when Q = 0 with one study, 0 when Q = 0 otherwise.</param>
/// <param name="H2">Q / df (Higgins &amp; Thompson 2002); NaN with one study.</param>
/// <param name="RandomEstimate">sum w*_i y_i / sum w*_i with w*_i = 1 / (v_i + Tau2).</param>
/// <param name="RandomStandardError">1 / sqrt(sum w*_i).</param>
/// <param name="RandomInterval">RandomEstimate +/- z RandomStandardError.</param>
public sealed record MetaAnalysisResult(
    int StudyCount,
    double FixedEstimate,
    double FixedStandardError,
    double Q,
    int DegreesOfFreedom,
    double QPValue,
    double Tau2,
    double I2,
    double H2,
    double RandomEstimate,
    double RandomStandardError,
    ConfidenceInterval RandomInterval);
