using System.Globalization;
using System.Text;
using System.Text.Json;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// `check`, `screen` and `grow` on a measured and a time-to-event outcome (console and JSON): every verb
/// takes every outcome kind, and `check` says so in its verdict. Expected summaries come from R: the Kaplan-Meier and reverse
/// Kaplan-Meier medians of reference/survival/survival_reference.json (survival 3.5.3) and the
/// type-7 quartiles of reference/survival/outcome_quartiles.json (make_outcome_quartiles.R).
/// </summary>
public sealed class OutcomeKindCommandTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static JsonElement DataSet(string file, string name)
    {
        using var document = JsonDocument.Parse(File.ReadAllText(Path.Combine(ReferenceData.Directory, "survival", file)));
        foreach (var set in document.RootElement.GetProperty("data_sets").EnumerateArray())
            if (set.GetProperty("name").GetString() == name) return set.Clone();
        throw new InvalidOperationException($"No data set {name} in {file}.");
    }

    /// <summary>The reference data set as a matrix (two invented features) and a sample sheet with time, status and x.</summary>
    private (string Matrix, string Sheet) Files(JsonElement set)
    {
        var time = set.GetProperty("time").EnumerateArray().Select(t => t.GetDouble()).ToArray();
        var status = set.GetProperty("status").EnumerateArray().Select(t => t.GetInt32()).ToArray();
        var x = set.GetProperty("x").EnumerateArray().Select(t => t.GetDouble()).ToArray();
        var matrix = new StringBuilder("sample_id,f1,f2\n");
        var sheet = new StringBuilder("sample_id,time,status,x\n");
        for (int s = 0; s < time.Length; s++)
        {
            matrix.Append(CultureInfo.InvariantCulture, $"s{s},{s % 7},{(s * 5) % 11}\n");
            sheet.Append(CultureInfo.InvariantCulture, $"s{s},{time[s]:R},{status[s]},{x[s]:R}\n");
        }
        return (_folder.File("m.csv", matrix.ToString()), _folder.File("sheet.csv", sheet.ToString()));
    }

    [Fact]
    public void Check_summarises_a_measured_outcome_with_r_quartiles()
    {
        var (matrix, sheet) = Files(DataSet("survival_reference.json", "invented_continuous"));
        var expected = DataSet("outcome_quartiles.json", "invented_continuous");

        var json = CliHarness.Run("check", matrix, "--samples", sheet, "--outcome", "x", "--json");
        // Described, and screenable: the exit code that screen gives for the same files.
        Assert.Equal(ExitCode.Success, json.ExitCode);
        using var document = JsonDocument.Parse(json.Out);
        var outcome = document.RootElement.GetProperty("outcome");
        Assert.Equal("measured", outcome.GetProperty("kind").GetString());
        var measured = outcome.GetProperty("measured");
        Assert.Equal(120, measured.GetProperty("samples").GetInt32());
        Assert.Equal(0, measured.GetProperty("missing").GetInt32());
        // R quantile(x, type = 7); both sides are double arithmetic on the same numbers.
        foreach (var key in new[] { "min", "lower_quartile", "median", "upper_quartile", "max" })
            Assert.Equal(expected.GetProperty(key).GetDouble(), measured.GetProperty(key).GetDouble(), 12);
        Assert.Equal("measured", document.RootElement.GetProperty("inspection").GetProperty("outcome_kind").GetString());
        Assert.True(document.RootElement.GetProperty("can_screen").GetBoolean());

        var console = CliHarness.Run("check", matrix, "--samples", sheet, "--outcome", "x");
        Assert.Equal(ExitCode.Success, console.ExitCode);
        Assert.Contains("Verdict: the panel can be screened.", console.Out);
        Assert.Contains("x: a measured quantity (--outcome-kind classes reads its values as classes instead)", console.Out);
        Assert.Contains("120 samples, 0 missing; min -1.879, quartiles -0.60225 / -0.0325 / 0.69175, max 2.639", console.Out);
    }

    [Theory]
    [InlineData("invented_continuous")]
    [InlineData("invented_heavy_ties")]
    [InlineData("gehan")]
    public void Check_summarises_a_time_to_event_outcome_with_r_kaplan_meier_medians(string name)
    {
        var set = DataSet("survival_reference.json", name);
        var (matrix, sheet) = Files(set);
        int samples = set.GetProperty("time").GetArrayLength();
        int events = set.GetProperty("status").EnumerateArray().Sum(s => s.GetInt32());
        // R's survfit: event times with more than one event.
        int tied = set.GetProperty("km_n_event").EnumerateArray().Count(e => e.GetInt32() > 1);

        var json = CliHarness.Run("check", matrix, "--samples", sheet, "--follow-up", "time", "--event", "status", "--json");
        Assert.Equal(ExitCode.Success, json.ExitCode);
        using var document = JsonDocument.Parse(json.Out);
        var outcome = document.RootElement.GetProperty("outcome");
        Assert.Equal("time_to_event", outcome.GetProperty("kind").GetString());
        var followUp = outcome.GetProperty("follow_up");
        Assert.Equal(samples, followUp.GetProperty("samples").GetInt32());
        Assert.Equal(events, followUp.GetProperty("events").GetInt32());
        Assert.Equal(samples - events, followUp.GetProperty("censored").GetInt32());
        Assert.Equal(tied, followUp.GetProperty("tied_event_times").GetInt32());
        // survfit(Surv(time, status) ~ 1) median and survfit(Surv(time, 1 - status) ~ 1) median (Schemper & Smith 1996).
        Assert.Equal(set.GetProperty("km_median").GetDouble(), followUp.GetProperty("median_survival").GetDouble(), 12);
        Assert.Equal(set.GetProperty("reverse_km_median").GetDouble(), followUp.GetProperty("median_follow_up").GetDouble(), 12);

        var console = CliHarness.Run("check", matrix, "--samples", sheet, "--follow-up", "time", "--event", "status");
        Assert.Equal(ExitCode.Success, console.ExitCode);
        Assert.Contains("Verdict: the panel can be screened.", console.Out);
        Assert.Contains("time to event: follow-up 'time', event 'status'", console.Out);
        Assert.Contains(FormattableString.Invariant($"{events} events, {samples - events} censored, of {samples} samples; {tied} event times shared by several events"), console.Out);
        Assert.Contains(FormattableString.Invariant($"{set.GetProperty("km_median").GetDouble():G6} (Kaplan-Meier)"), console.Out);
    }

    [Fact]
    public void Check_says_not_reached_when_the_curve_stays_above_one_half()
    {
        var matrix = new StringBuilder("sample_id,f1\n");
        var sheet = new StringBuilder("sample_id,months,died\n");
        // 60 samples, 12 events early, the rest censored late: survival stays at 0.8 (hand count).
        for (int s = 0; s < 60; s++)
        {
            matrix.Append(CultureInfo.InvariantCulture, $"s{s},{s % 9}\n");
            sheet.Append(CultureInfo.InvariantCulture, $"s{s},{(s < 12 ? s + 1 : 100 + s)},{(s < 12 ? "yes" : "no")}\n");
        }
        var run = CliHarness.Run("check", _folder.File("m.csv", matrix.ToString()), "--samples", _folder.File("s.csv", sheet.ToString()),
            "--follow-up", "months", "--event", "died");

        // 12 events: screenable, with the few-events warning (fewer than 50).
        Assert.Equal(ExitCode.Success, run.ExitCode);
        Assert.Contains("not reached (Kaplan-Meier)", run.Out);
        Assert.Contains("few-events", run.Out);
    }

    [Fact]
    public void Check_refuses_fewer_than_ten_events_with_the_not_screenable_code()
    {
        var matrix = new StringBuilder("sample_id,f1\n");
        var sheet = new StringBuilder("sample_id,months,died\n");
        for (int s = 0; s < 40; s++)
        {
            matrix.Append(CultureInfo.InvariantCulture, $"s{s},{s % 9}\n");
            sheet.Append(CultureInfo.InvariantCulture, $"s{s},{s + 1},{(s % 5 == 0 ? 1 : 0)}\n");
        }
        var run = CliHarness.Run("check", _folder.File("m.csv", matrix.ToString()), "--samples", _folder.File("s.csv", sheet.ToString()),
            "--follow-up", "months", "--event", "died");

        Assert.Equal(ExitCode.NotScreenable, run.ExitCode);
        Assert.Contains("too-few-events", run.Out);
        Assert.Contains("records 8 events among 40 samples", run.Out);
        Assert.Contains("Verdict: the panel cannot be screened until the errors are fixed.", run.Out);
    }

    [Theory]
    [InlineData("measured")]
    [InlineData("time")]
    public void Grow_grows_the_kinds_forest_and_states_the_kind_in_one_line(string kind)
    {
        var (matrix, sheet) = Files(DataSet("survival_reference.json", "invented_continuous"));
        string importance = Path.Combine(_folder.Path, "importance.tsv");
        string[] outcome = kind == "measured" ? ["--outcome", "x"] : ["--follow-up", "time", "--event", "status"];

        var run = CliHarness.Run(["grow", matrix, "--samples", sheet, .. outcome, "--trees", "100", "--importance-out", importance]);

        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        Assert.Single(run.Out.Split('\n'), line => line.StartsWith("Outcome: ", StringComparison.Ordinal));
        Assert.Contains(kind == "measured" ? "a measured quantity: a regression forest" : "a random survival forest", run.Out);
        Assert.Contains(kind == "measured" ? "out-of-bag R²" : "out-of-bag concordance (Harrell's C)", run.Out);
        // The smallest leaf is the kind's default, as in `screen`.
        Assert.Contains("smallest leaf 5", run.Out);
        Assert.StartsWith(kind == "measured"
            ? "rank\tfeature\tmean_variance_decrease\tshare_of_total\tpermutation_mse_rise\tpermutation_se\n"
            : "rank\tfeature\tmean_log_rank_statistic\tshare_of_total\tpermutation_concordance_drop\tpermutation_se\n", File.ReadAllText(importance));
        Assert.DoesNotContain("classes only", run.Error);
    }

    [Theory]
    [InlineData(new[] { "--outcome", "x", "--follow-up", "time", "--event", "status" }, "name two different outcomes")]
    [InlineData(new[] { "--follow-up", "time" }, "add --event COLUMN")]
    [InlineData(new[] { "--event", "status" }, "add --follow-up COLUMN")]
    [InlineData(new string[0], "name the outcome: --outcome COLUMN")]
    [InlineData(new[] { "--follow-up", "time", "--event", "status", "--outcome-kind", "measured" }, "leave it out with --follow-up")]
    public void Outcome_options_that_do_not_fit_together_are_usage_errors(string[] options, string message)
    {
        var (matrix, sheet) = Files(DataSet("survival_reference.json", "gehan"));

        var run = CliHarness.Run(["check", matrix, "--samples", sheet, .. options]);

        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains(message, run.Error);
    }

    [Fact]
    public void A_bad_event_code_is_an_input_error_naming_the_line()
    {
        string matrix = _folder.File("m.csv", "sample_id,f1\na,1\nb,2\nc,3\n");
        string sheet = _folder.File("s.csv", "sample_id,t,e\na,1,1\nb,2,dead\nc,3,0\n");

        var run = CliHarness.Run("check", matrix, "--samples", sheet, "--follow-up", "t", "--event", "e");

        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("s.csv, line 3, column 'e': sample 'b' has the event code 'dead'", run.Error);
    }
}
