using System.Globalization;
using System.Text;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Runs.Results;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// The hostile-user corpus of issue 13: outputs pointed at inputs, pipes, devices, links and
/// other verbs' folders; two runs into one folder; faults while writing. Each case names the
/// numbered finding of the issue it comes from.
/// </summary>
internal static class MisuseCorpus
{
    private const string Importance = "--importance-out";

    private static string[] Grow(MisuseScene scene, string importanceOut) =>
        ["grow", scene.Panel(), "--samples", scene.Sheet(), "--outcome", "status", "--trees", "10", Importance, importanceOut];

    private static string[] ApplyInto(MisuseScene scene, string model, string outFolder, params string[] extra) =>
        ApplyTo(ReferenceData.Wdbc("wdbc.csv"), model, outFolder, extra);

    private static string[] ApplyTo(string matrix, string model, string outFolder, params string[] extra) =>
        ["apply", model, matrix, "--outcome", "diagnosis", "--out", outFolder, .. extra];

    private static string[] DemoPanel(string panelFolder) => ["demo", "--panel-only", "--panel-dir", panelFolder];

    private static IReadOnlySet<string> Everything(MisuseScene scene) => new HashSet<string>(FolderSnapshot.Take(scene.Root).Paths);

    public static IEnumerable<MisuseCase> All() => Cases().Concat(SettingsCases()).Concat(OptionRangeCases()).Concat(NameCases()).Concat(PipeCases())
        .Concat(UnmeasuredMarkerCases());

    public static IEnumerable<MisuseCase> Cases()
    {
        // 1. grow --importance-out replaced whatever it named.
        string[] notAFile = [Importance, "new file name"];
        yield return new("1 grow --importance-out naming the input matrix", s => Grow(s, s.PathOf("m.csv")),
            ExitCode.OutputError, [Importance, "m.csv", "input of this run", "new file name"]);
        yield return new("1 grow --importance-out naming the sample sheet", s => Grow(s, s.PathOf("s.csv")),
            ExitCode.OutputError, [Importance, "s.csv", "input of this run"]);
        yield return new("1 grow --importance-out naming the input matrix by another spelling", s => Grow(s, Path.Combine(s.Folder("sub"), "..", ".", "m.csv")),
            ExitCode.OutputError, [Importance, "input of this run"]);
        yield return new("1 grow --importance-out naming a FIFO", s => Grow(s, s.Fifo("out.tsv")),
            ExitCode.OutputError, [.. notAFile, "out.tsv", "named pipe"]);
        if (MisuseScene.CanMakeDevices)
            yield return new("1 grow --importance-out naming a device file", s => Grow(s, s.Device("null-copy")),
                ExitCode.OutputError, [.. notAFile, "device file"]);
        yield return new("1 grow --importance-out naming a symbolic link to the user's file", s => Grow(s, s.Link("out.tsv", s.File("notes.txt", "mine\n"))),
            ExitCode.OutputError, [.. notAFile, "symbolic link"]);
        yield return new("1 grow --importance-out naming a symbolic link to the input matrix", s => Grow(s, s.Link("out.tsv", s.PathOf("m.csv"))),
            ExitCode.OutputError, [.. notAFile, "symbolic link"]);
        yield return new("1 grow --importance-out naming a folder", s => Grow(s, s.Folder("out.tsv")),
            ExitCode.OutputError, [.. notAFile, "a folder"]);
        yield return new("1 grow --importance-out naming a file the tool did not write", s => Grow(s, s.File("out.tsv", "my notes\n")),
            ExitCode.OutputError, [Importance, "out.tsv", "not written by this tool", "remove the file first"]);
        yield return new("1 grow --importance-out replaces its own earlier file",
            s => Grow(s, s.File("out.tsv", ImportanceWriter.HeaderLine + "1\tf1\t0.5\t0.5\n")),
            ExitCode.Success, ["out-of-bag error"],
            MayWrite: s => new HashSet<string> { "out.tsv" },
            Verify: (s, _) => Assert.Contains("\tf3\t", File.ReadAllText(s.PathOf("out.tsv"))));

        // 5. apply --out replaced a screen's manifest; and the other way round.
        yield return new("5 apply --out naming a screen's results folder", s => ApplyInto(s, Path.Combine(s.ScreenFolder("r"), "locked_panel.json"), s.PathOf("r")),
            ExitCode.OutputError, ["holds the results of `screen`", "choose another --out folder"]);
        yield return new("5 apply --out naming a screen's results folder with --force",
            s => ApplyInto(s, Path.Combine(s.ScreenFolder("r"), "locked_panel.json"), s.PathOf("r"), "--force"),
            ExitCode.OutputError, ["holds the results of `screen`", "choose another --out folder"]);
        yield return new("5 screen --out naming an apply results folder", s =>
            {
                string model = Path.Combine(s.ScreenFolder("r"), "locked_panel.json");
                var applied = CliHarness.Run(ApplyInto(s, model, s.PathOf("applied")));
                Assert.True(applied.ExitCode == ExitCode.Success, applied.Error);
                return MisuseScene.SmallScreen(s.PathOf("applied"));
            },
            ExitCode.OutputError, ["holds the results of `apply`", "choose another --out folder"]);
        yield return new("5 apply --out naming a file", s => ApplyInto(s, Path.Combine(s.ScreenFolder("r"), "locked_panel.json"), s.File("out", "x")),
            ExitCode.OutputError, ["is a file", "give --out a folder"]);

        // 6. A refused screen deleted the manifest before refusing.
        yield return new("6 a stray file in checkpoint/ refuses the re-screen and keeps the manifest", s =>
            {
                string results = s.ScreenFolder("r");
                s.File("r/checkpoint/.DS_Store", "Bud1");
                return MisuseScene.SmallScreen(results);
            },
            ExitCode.OutputError, ["checkpoint", "not empty", "choose an empty folder"]);
        yield return new("6 checkpoint as a symbolic link refuses the re-screen and keeps the manifest", s =>
            {
                string results = s.ScreenFolder("r");
                s.File("elsewhere/precious.txt", "keep me\n");
                s.Link("r/checkpoint", s.PathOf("elsewhere"));
                return MisuseScene.SmallScreen(results);
            },
            ExitCode.OutputError, ["checkpoint", "symbolic link", "remove it"]);
        yield return new("6 checkpoint as a file refuses the re-screen", s =>
            {
                string results = s.ScreenFolder("r");
                s.File("r/checkpoint", "not a folder\n");
                return MisuseScene.SmallScreen(results);
            },
            ExitCode.OutputError, ["checkpoint", "is a file", "remove it"]);

        // An output name taken by something that is not a file of an earlier run.
        yield return new("shortlist.tsv of an earlier screen replaced by a FIFO", s =>
            {
                string results = s.ScreenFolder("r");
                File.Delete(Path.Combine(results, "shortlist.tsv"));
                s.Fifo("r/shortlist.tsv");
                return MisuseScene.SmallScreen(results);
            },
            ExitCode.OutputError, ["shortlist.tsv", "named pipe", "remove it"]);
        yield return new("report.html of an earlier screen replaced by a link out of the folder", s =>
            {
                string results = s.ScreenFolder("r");
                File.Delete(Path.Combine(results, "report.html"));
                s.Link("r/report.html", s.File("mine.html", "<p>mine</p>\n"));
                return MisuseScene.SmallScreen(results);
            },
            ExitCode.OutputError, ["report.html", "symbolic link", "remove it"]);
        yield return new("screen --force into a folder holding the input matrix under an output's name", s =>
                ["screen", s.File("r/features.tsv", MisuseScene.SmallPanel), "--samples", s.Sheet(), "--outcome", "status", "--out", s.PathOf("r"), "--force", "--quiet"],
            ExitCode.OutputError, ["features.tsv", "input of this run", "move the input out"]);
        yield return new("merge --out naming one of the part folders", s =>
            {
                foreach (var part in new[] { "1", "2" })
                {
                    var run = CliHarness.Run(MisuseScene.SmallScreen(s.PathOf("p" + part), "--part", part + "/2"));
                    Assert.True(run.ExitCode == ExitCode.Success, run.Error);
                }
                return ["merge", s.PathOf("p1"), s.PathOf("p2"), "--out", s.PathOf("p1"), "--quiet"];
            },
            ExitCode.OutputError, ["--out", "is, or overlaps, the part folder", "a folder of their own"]);
        yield return new("screen --out naming a FIFO", s => MisuseScene.SmallScreen(s.Fifo("out")),
            ExitCode.OutputError, ["named pipe", "give --out a folder"]);

        // 8. demo --panel-dir replaced the user's files.
        yield return new("8 demo --panel-dir holding the user's README.md", s => DemoPanel(Path.GetDirectoryName(s.File("d/README.md", "# My notes\n"))!),
            ExitCode.OutputError, ["--panel-dir", "README.md", "not written by this tool"]);
        yield return new("8 demo --panel-dir holding a user's file under the panel's name",
            s => DemoPanel(Path.GetDirectoryName(s.File("d/marrowfen_plasma.csv", "id,x\n1,2\n"))!),
            ExitCode.OutputError, ["marrowfen_plasma.csv", "not written by this tool"]);
        yield return new("8 demo --panel-dir with a FIFO under the truth table's name",
            s => DemoPanel(Path.GetDirectoryName(s.Fifo("d/marrowfen_truth.tsv"))!),
            ExitCode.OutputError, ["marrowfen_truth.tsv", "named pipe"]);
        yield return new("8 demo --panel-dir rewrites its own earlier panel", s =>
            {
                var first = CliHarness.Run(DemoPanel(s.PathOf("d")));
                Assert.True(first.ExitCode == ExitCode.Success, first.Error);
                return DemoPanel(s.PathOf("d"));
            },
            ExitCode.Success, ["Demo panel written"]);

        // 3. Nothing locked the folder.
        yield return new("3 a results folder locked by a running process", s =>
            {
                string results = s.ScreenFolder("r");
                s.Hold(HoldLock(results));
                return MisuseScene.SmallScreen(results);
            },
            ExitCode.OutputError, ["in use by another OmicsScreen run", "started", "wait for it to finish"],
            Verify: (_, run) => Assert.Contains($"process {Environment.ProcessId.ToString(CultureInfo.InvariantCulture)}", run.Error));
        yield return new("3 apply into a folder locked by a running process", s =>
            {
                string model = Path.Combine(s.ScreenFolder("r"), "locked_panel.json");
                s.Hold(HoldLock(s.Folder("applied")));
                return ApplyInto(s, model, s.PathOf("applied"));
            },
            ExitCode.OutputError, ["in use by another OmicsScreen run", "wait for it to finish"]);
        yield return new("3 a lock left by a process that died is taken over with a note", s =>
            {
                string results = s.ScreenFolder("r");
                File.WriteAllText(Path.Combine(results, ".omicsscreen.lock"), "");
                File.WriteAllText(Path.Combine(results, ".omicsscreen.lock.json"),
                    "{\"process_id\":2147483000,\"started_utc\":\"2026-01-01T00:00:00.0000000Z\",\"machine\":\"gone\"}");
                return MisuseScene.SmallScreen(results);
            },
            ExitCode.Success, ["process 2147483000", "no longer running", "taken over"],
            MayWrite: Everything,
            Verify: (s, _) =>
            {
                Assert.False(File.Exists(s.PathOf("r/.omicsscreen.lock")), "the lock is let go at the end");
                Assert.False(File.Exists(s.PathOf("r/.omicsscreen.lock.json")));
            });

        // 7. A re-screen left the earlier run's cohort tables and curve beside the new manifest.
        yield return new("7 a re-screen without --cohort or curve leaves only its own tables", s =>
            {
                string results = s.PathOf("r");
                var withCohorts = CliHarness.Run(MisuseScene.SmallScreen(results, "--samples", s.CohortSheet(), "--cohort", "group"));
                Assert.True(withCohorts.ExitCode == ExitCode.Success, withCohorts.Error);
                Assert.True(File.Exists(Path.Combine(results, "cohort_markers.tsv")));
                return MisuseScene.SmallScreen(results, "--curve-folds", "0");
            },
            ExitCode.Success, ["Shortlist"],
            MayWrite: Everything,
            Verify: (s, _) => AssertFolderHoldsOnlyItsManifestOutputs(s.PathOf("r")));

        // 15. Temporary files of a run killed while writing outlived the next run.
        yield return new("15 temporary files of a killed write are removed by the next run, others are kept", s =>
            {
                string results = s.ScreenFolder("r");
                s.File("r/.shortlist.tsv.2147483000.0123456789abcdef0123456789abcdef.partial", "rank\tfeat");
                s.File("r/.manifest.json.2147483000.0123456789abcdef0123456789abcdef.partial", "{");
                s.File("r/.notes.partial", "the user's own\n");
                return MisuseScene.SmallScreen(results);
            },
            ExitCode.Success, ["Shortlist"],
            MayWrite: Everything,
            Verify: (s, _) =>
            {
                Assert.Equal([".notes.partial"], Directory.GetFiles(s.PathOf("r"), "*.partial").Select(Path.GetFileName));
                AssertFolderHoldsOnlyItsManifestOutputs(s.PathOf("r"), ".notes.partial");
            });
    }

    /// <summary>Cases of findings 10, 11 and 12: crashes and silent runs on meaningless settings, and one exit code per kind of problem.</summary>
    public static IEnumerable<MisuseCase> SettingsCases()
    {
        const string TwoSamples = "sample_id,f1,f2\ns1,1,2\ns4,7,8\n";
        const string TwoSampleSheet = "sample_id,status\ns1,case\ns4,control\n";
        foreach (var verb in new[] { "check", "screen", "grow" })
            yield return new($"12 {verb} of a panel that cannot be screened ends with exit 3", s =>
                    [verb, s.File("two.csv", TwoSamples), "--samples", s.File("two_sheet.csv", TwoSampleSheet), "--outcome", "status",
                        .. verb == "screen" ? new[] { "--out", s.PathOf("r"), "--quiet" } : []],
                ExitCode.NotScreenable, ["cannot be screened"]);
        foreach (var verb in new[] { "check", "screen" })
            yield return new($"12 {verb} with every sample in one subject ends with exit 3", s =>
                {
                    var (matrix, sheet) = s.SubjectPanel(1);
                    return [verb, matrix, "--samples", sheet, "--outcome", "status", "--subject", "subject", .. verb == "screen" ? new[] { "--out", s.PathOf("r"), "--quiet" } : []];
                },
                ExitCode.NotScreenable, ["cannot be screened", "one subject of 'subject'", "at least two subjects"]);

        yield return new("10 a locked panel with a property given twice", s =>
            {
                string results = s.ScreenFolder("r");
                string model = Path.Combine(results, "locked_panel.json");
                string text = File.ReadAllText(model);
                int brace = text.IndexOf('{', StringComparison.Ordinal);
                File.WriteAllText(model, text[..(brace + 1)] + "\n  \"version\": 1," + text[(brace + 1)..]);
                return ApplyInto(s, model, s.PathOf("applied"));
            },
            ExitCode.InputError, ["locked_panel.json", "appears twice", "Lock the panel again"]);
        yield return new("10 --curve-folds larger than the sample count", s =>
                ["screen", s.Panel(), "--samples", s.Sheet(), "--outcome", "status", "--curve-folds", "10", "--out", s.PathOf("r"), "--quiet"],
            ExitCode.Usage, ["--curve-folds 10", "the panel has 6", "or 0 to skip the panel-size curve"]);
        yield return new("10 --curve-folds past the inner screens' seed family", s =>
                ["screen", s.Panel(), "--samples", s.Sheet(), "--outcome", "status", "--curve-folds", "1000", "--out", s.PathOf("r"), "--quiet"],
            ExitCode.Usage, ["--curve-folds", "1000", "must be below 1000"]);
        yield return new("10 --subject with three mixed-class subjects and 2 curve folds", s =>
            {
                var (matrix, sheet) = s.SubjectPanel(3);
                return ["screen", matrix, "--samples", sheet, "--outcome", "status", "--subject", "subject", "--curve-folds", "2",
                    "--pairs", "2", "--trees", "20", "--out", s.PathOf("r"), "--quiet"];
            },
            ExitCode.Usage, ["--curve-folds 2", "subjects (--subject subject)", "the panel has 3", "Use --curve-folds 3 or fewer"]);
        yield return new("10 --subject with three subjects and 3 curve folds is screened", s =>
            {
                var (matrix, sheet) = s.SubjectPanel(3);
                return ["screen", matrix, "--samples", sheet, "--outcome", "status", "--subject", "subject", "--curve-folds", "3",
                    "--pairs", "2", "--trees", "20", "--max-panel-size", "2", "--out", s.PathOf("r"), "--quiet"];
            },
            ExitCode.Success, ["Shortlist"]);
        yield return new("11 screen --min-leaf above the sample count", s =>
                MisuseScene.SmallScreen(s.PathOf("r"), "--min-leaf", "600"),
            ExitCode.Usage, ["--min-leaf 600", "single leaf", "half-samples of 284", "--min-leaf 71 or less"]);
        yield return new("11 screen --min-leaf too large for the half-samples", s =>
                MisuseScene.SmallScreen(s.PathOf("r"), "--min-leaf", "143"),
            ExitCode.Usage, ["--min-leaf 143", "single leaf"]);
        yield return new("11 grow --min-leaf above the sample count", s =>
                ["grow", s.Panel(), "--samples", s.Sheet(), "--outcome", "status", "--min-leaf", "7"],
            ExitCode.Usage, ["--min-leaf 7", "single leaf", "6 samples"]);
    }

    /// <summary>
    /// Finding 11, for every numeric option of `screen`, `grow` and `apply`: a value with which
    /// nothing sensible can come out is refused before any work with exit code 1, the option, the
    /// value and the range that works; a legal but weak one runs with a warning on the console
    /// (and, for `screen`, in the manifest's warnings list).
    /// </summary>
    public static IEnumerable<MisuseCase> OptionRangeCases()
    {
        // Refused from the options alone, before the panel is read.
        var screenRefusals = new (string Option, string Value, string[] Fragments)[]
        {
            ("--trees", "5", ["--trees 5", "at least 10"]),
            ("--pairs", "0", ["--pairs 0", "at least 1"]),
            ("--features-per-split", "0", ["--features-per-split 0", "at least 1", "square root of the feature count"]),
            ("--min-leaf", "0", ["--min-leaf 0", "at least 1"]),
            ("--repeat-level", "0.5", ["--repeat-level 0.5", "between 0 and 0.5"]),
            ("--repeat-level", "0", ["--repeat-level 0", "between 0 and 0.5"]),
            ("--per-repeat-cap", "0", ["--per-repeat-cap 0", "at least 1", "leave it out for no cap"]),
            ("--min-frequency", "0.3", ["--min-frequency 0.3", "above 0.5 and at most 1"]),
            ("--min-frequency", "1.5", ["--min-frequency 1.5", "above 0.5 and at most 1"]),
            ("--max-q", "0", ["--max-q 0", "above 0 and at most 1"]),
            ("--max-q", "1.5", ["--max-q 1.5", "above 0 and at most 1"]),
            ("--decoys", "-1", ["--decoys -1", "at least 0", "automatic count"]),
            ("--decoys", "5", ["--decoys 5", "never give a shortlist at --max-q 0.1", "cannot fall below 0.1667", "give at least 9"]),
            ("--outcome-permutations", "-1", ["--outcome-permutations -1", "0 or more"]),
            ("--redundancy-rho", "0", ["--redundancy-rho 0", "above 0 and at most 1"]),
            ("--redundancy-rho", "1.2", ["--redundancy-rho 1.2", "above 0 and at most 1"]),
            ("--curve-folds", "1", ["--curve-folds 1", "at least 2", "or 0 to skip"]),
            ("--curve-repeats", "0", ["--curve-repeats 0", "at least 1"]),
            ("--curve-inner-pairs", "0", ["--curve-inner-pairs 0", "at least 1"]),
            ("--max-panel-size", "0", ["--max-panel-size 0", "at least 1"]),
            ("--threads", "0", ["--threads 0", "at least 1", "all cores"]),
            ("--threads", "-2", ["--threads -2", "at least 1", "all cores"]),
        };
        foreach (var (option, value, fragments) in screenRefusals)
            yield return new($"11 screen {option} {value} is refused before any work", s => MisuseScene.SmallScreen(s.PathOf("r"), option, value),
                ExitCode.Usage, fragments);
        // The decoy bound's smallest value is 1/decoys (a list of every feature, no decoy passing).
        yield return new("11 screen --decoys 9 with the decoy-bound rule is refused before any work",
            s => MisuseScene.SmallScreen(s.PathOf("r"), "--decoys", "9", "--shortlist-rule", "decoy-bound"),
            ExitCode.Usage, ["--decoys 9", "the decoy bound cannot fall below 0.1111", "give at least 10"]);

        // From 100 decoys on the p-values' tail fit reaches below 1/(decoys + 1): a strict --max-q is then legal.
        yield return new("11 screen --decoys 150 with --max-q 0.001 is screened", s => MisuseScene.SmallScreen(s.PathOf("r"), "--decoys", "150", "--max-q", "0.001"),
            ExitCode.Success, ["Shortlist"]);

        // Refused once the panel's size is known (WDBC: 569 samples, 30 features, 212 malignant), still before any forest.
        yield return new("11 screen --features-per-split above the feature count", s => MisuseScene.SmallScreen(s.PathOf("r"), "--features-per-split", "31"),
            ExitCode.Usage, ["--features-per-split 31", "30 features", "--features-per-split 30 or fewer"]);
        // A bootstrap of the 284-sample half holds about 180 distinct samples: min-leaf 100 cannot split it.
        yield return new("11 screen --min-leaf past the distinct samples of a half-sample's bootstrap", s => MisuseScene.SmallScreen(s.PathOf("r"), "--min-leaf", "100"),
            ExitCode.Usage, ["--min-leaf 100", "single leaf", "about 180 distinct", "--min-leaf 71 or less"]);
        // With 2 curve folds the inner screens grow on halves of 284 training samples: about 90 distinct in a bootstrap.
        yield return new("11 screen --min-leaf that leaves the curve's inner trees one leaf", s => MisuseScene.SmallScreen(s.PathOf("r"), "--min-leaf", "60"),
            ExitCode.Usage, ["--min-leaf 60", "panel-size curve's inner screens", "about 142 samples", "--min-leaf 35 or less", "--curve-folds 0"]);
        yield return new("11 screen --curve-folds above the smallest class", s =>
            {
                var (matrix, sheet) = RareClassPanel(s);
                return ["screen", matrix, "--samples", sheet, "--outcome", "status", "--curve-folds", "5", "--pairs", "2", "--trees", "20", "--out", s.PathOf("r"), "--quiet"];
            },
            ExitCode.Usage, ["--curve-folds 5", "4 samples of the smallest class 'case'", "AUC", "undefined", "--curve-folds 4 or fewer"]);
        yield return new("11 screen --curve-folds equal to the smallest class is screened", s =>
            {
                var (matrix, sheet) = RareClassPanel(s);
                return ["screen", matrix, "--samples", sheet, "--outcome", "status", "--curve-folds", "4", "--pairs", "2", "--trees", "20",
                    "--curve-inner-pairs", "1", "--max-panel-size", "2", "--out", s.PathOf("r"), "--quiet"];
            },
            ExitCode.Success, ["Panel-size curve"],
            Verify: (_, run) => Assert.DoesNotContain("NaN", run.Out));

        // Legal but weak: the run goes ahead, warns on the console and keeps the warnings in the manifest.
        yield return new("11 screen with few trees, pairs and decoys warns and records it", s => MisuseScene.SmallScreen(s.PathOf("r"), "--decoys", "50"),
            ExitCode.Success, ["warning: --trees 20 is few", "warning: --pairs 2 gives only 4", "warning: --decoys 50 is too few for the p-values' tail fit"],
            Verify: (s, _) =>
            {
                using var manifest = System.Text.Json.JsonDocument.Parse(File.ReadAllText(s.PathOf("r/manifest.json")));
                var warnings = manifest.RootElement.GetProperty("warnings").EnumerateArray().Select(w => w.GetString()!).ToArray();
                Assert.Contains(warnings, w => w.StartsWith("--trees 20", StringComparison.Ordinal));
                Assert.Contains(warnings, w => w.StartsWith("--pairs 2", StringComparison.Ordinal));
                Assert.Contains(warnings, w => w.StartsWith("--decoys 50", StringComparison.Ordinal));
                Assert.Contains("Warnings of this run", File.ReadAllText(s.PathOf("r/report.html")));
            });
        yield return new("11 screen with a loose --max-q, a low --redundancy-rho and few outcome permutations warns", s =>
                MisuseScene.SmallScreen(s.PathOf("r"), "--max-q", "0.4", "--redundancy-rho", "0.2", "--features-per-split", "30", "--outcome-permutations", "3"),
            ExitCode.Success, ["warning: --max-q 0.4 lets up to 40%", "warning: --redundancy-rho 0.2", "warning: --features-per-split 30 tries every feature",
                "warning: --outcome-permutations 3 gives permutation p-values no smaller than 1/(3 + 1) = 0.25"]);
        yield return new("11 screen with the outcome in both the matrix and the sheet warns and records it", s =>
            {
                var lines = File.ReadAllLines(ReferenceData.Wdbc("wdbc.csv")).Skip(1).Select(line => line.Split(',')).Select(cells => cells[0] + "," + cells[1]);
                string sheet = s.File("wdbc_sheet.csv", "sample_id,diagnosis\n" + string.Join("\n", lines) + "\n");
                return MisuseScene.SmallScreen(s.PathOf("r"), "--samples", sheet);
            },
            ExitCode.Success, ["warning: the outcome column 'diagnosis' is both in the sample sheet wdbc_sheet.csv and in the matrix wdbc.csv", "their values agree"],
            Verify: (s, _) => Assert.Contains("both in the sample sheet", File.ReadAllText(s.PathOf("r/manifest.json"))));

        // The loader's warnings join the run's; in the report, one that names samples says how many instead (README: ids stay out of the report).
        yield return new("11 screen --drop-unmatched warns naming the dropped samples, and the report only counts them", s =>
            {
                var lines = File.ReadAllLines(ReferenceData.Wdbc("wdbc.csv")).Skip(4).Select(line => line.Split(',')).Select(cells => cells[0] + ",x");
                string sheet = s.File("partial_sheet.csv", "sample_id,note\n" + string.Join("\n", lines) + "\nQ7777,x\n");
                return MisuseScene.SmallScreen(s.PathOf("r"), "--samples", sheet, "--drop-unmatched");
            },
            ExitCode.Success, ["warning: 4 samples were dropped", "S0001", "Q7777"],
            Verify: (s, _) =>
            {
                string report = File.ReadAllText(s.PathOf("r/report.html"));
                Assert.Contains("4 samples were dropped because they are in only one file", report);
                Assert.DoesNotContain("S0001", report);
                Assert.DoesNotContain("Q7777", report);
            });

        // grow: refused before the forest is grown.
        string[] Grow(MisuseScene s, params string[] extra) => ["grow", s.Panel(), "--samples", s.Sheet(), "--outcome", "status", .. extra];
        yield return new("11 grow --trees 0", s => Grow(s, "--trees", "0"), ExitCode.Usage, ["--trees", "at least 1"]);
        yield return new("11 grow --features-per-split 0", s => Grow(s, "--features-per-split", "0"), ExitCode.Usage, ["--features-per-split 0", "at least 1", "square root"]);
        yield return new("11 grow --features-per-split above the feature count", s => Grow(s, "--features-per-split", "4"),
            ExitCode.Usage, ["--features-per-split 4", "3 features", "--features-per-split 3 or fewer"]);
        yield return new("11 grow --max-depth 0", s => Grow(s, "--max-depth", "0"), ExitCode.Usage, ["--max-depth 0", "single leaf", "1 or more"]);
        yield return new("11 grow --sample-fraction 1 leaves nothing out of bag", s => Grow(s, "--sample-fraction", "1"),
            ExitCode.Usage, ["--sample-fraction 1", "no sample is ever out of bag", "for example 0.632"]);
        yield return new("11 grow --sample-fraction 0 is out of range", s => Grow(s, "--sample-fraction", "0"),
            ExitCode.Usage, ["--sample-fraction", "above 0 and at most 1"]);
        yield return new("11 grow --sample-fraction drawing one sample per tree", s => Grow(s, "--sample-fraction", "0.1"),
            ExitCode.Usage, ["single leaf", "draws 1 of the panel's 6 samples", "larger --sample-fraction"]);
        yield return new("11 grow --threads 0", s => Grow(s, "--threads", "0"), ExitCode.Usage, ["--threads 0", "at least 1", "all cores"]);
        yield return new("11 grow with few trees warns", s => Grow(s, "--trees", "10"),
            ExitCode.Success, ["warning: --trees 10 is few", "out-of-bag error"]);

        // apply's one number is the horizon of a follow-up panel; a sheet without an outcome cannot work either.
        yield return new("11 apply with a sample sheet but no --outcome", s =>
                ["apply", Path.Combine(s.ScreenFolder("r"), "locked_panel.json"), ReferenceData.Wdbc("wdbc.csv"), "--samples", s.Sheet(), "--out", s.PathOf("applied")],
            ExitCode.Usage, ["sample sheet was given without --outcome", "name the outcome column"]);
        yield return new("11 apply --horizon 0", s =>
                ["apply", Path.Combine(s.ScreenFolder("r"), "locked_panel.json"), ReferenceData.Wdbc("wdbc.csv"), "--samples", s.Sheet(),
                    "--follow-up", "months", "--event", "relapse", "--horizon", "0", "--out", s.PathOf("applied")],
            ExitCode.Usage, ["--horizon 0 is not a positive time", "follow-up column's unit"]);
        yield return new("11 apply --horizon without follow-up", s =>
                ["apply", Path.Combine(s.ScreenFolder("r"), "locked_panel.json"), ReferenceData.Wdbc("wdbc.csv"), "--horizon", "12", "--out", s.PathOf("applied")],
            ExitCode.Usage, ["--horizon needs the cohort's follow-up", "--follow-up and --event"]);
    }

    /// <summary>A 40-sample panel with 4 cases and 36 controls, the first two features shifted in cases.</summary>
    private static (string Matrix, string Sheet) RareClassPanel(MisuseScene scene)
    {
        var matrix = new StringBuilder("sample_id,f1,f2,f3,f4\n");
        var sheet = new StringBuilder("sample_id,status\n");
        for (int i = 0; i < 40; i++)
        {
            int shift = i < 4 ? 9 : 0;
            matrix.Append(CultureInfo.InvariantCulture, $"s{i},{(i * 7) % 13 + shift},{(i * 5) % 11 + shift},{(i * 3) % 7},{i % 5}\n");
            sheet.Append(CultureInfo.InvariantCulture, $"s{i},{(i < 4 ? "case" : "control")}\n");
        }
        return (scene.File("rare.csv", matrix.ToString()), scene.File("rare_sheet.csv", sheet.ToString()));
    }

    /// <summary>Cases of findings 13 and 14: names a reader would misread, and messages in the user's terms.</summary>
    public static IEnumerable<MisuseCase> NameCases()
    {
        const string Names = "sample_id,NA,\"\"\"quoted\",ab\u202Ecd,x\u200By\ns1,1,2,7,1\ns2,3,4,1,2\ns3,5,6,3,3\ns4,7,8,2,4\ns5,9,10,8,5\ns6,11,13,5,6\n";
        yield return new("13 feature names NA and a leading quote are written so a table reader reads them back", s =>
                ["grow", s.File("names.csv", Names), "--samples", s.Sheet(), "--outcome", "status", "--trees", "10", Importance, s.PathOf("out.tsv")],
            ExitCode.Success, ["out-of-bag error"],
            Verify: (s, _) =>
            {
                var cells = File.ReadAllLines(s.PathOf("out.tsv")).Skip(1).Select(line => line.Split('\t')[1]).ToArray();
                // R's read.delim and pandas read "NA" as missing and a leading '"' as the start of a quoted field (common practice).
                Assert.Contains("'NA", cells);
                Assert.Contains("'\"quoted", cells);
                Assert.DoesNotContain("NA", cells);
            });
        yield return new("13 bidirectional and zero-width characters in names are shown with a visible mark", s =>
                ["grow", s.File("names.csv", Names), "--samples", s.Sheet(), "--outcome", "status", "--trees", "10"],
            ExitCode.Success, ["ab<U+202E>cd", "x<U+200B>y"],
            Verify: (_, run) =>
            {
                Assert.DoesNotContain("\u202E", run.Out);
                Assert.DoesNotContain("\u200B", run.Out);
            });
        yield return new("14 --seed -1 is explained as the range of a seed", s =>
                ["grow", s.Panel(), "--samples", s.Sheet(), "--outcome", "status", "--seed", "-1"],
            ExitCode.Usage, ["--seed", "whole number from 0 to 18446744073709551615"],
            Verify: (_, run) => Assert.DoesNotContain("System.UInt64", run.Error));
    }

    /// <summary>Cases of finding 9: inputs that are pipes, which used to hang or read as blank.</summary>
    public static IEnumerable<MisuseCase> PipeCases()
    {
        string[] refusal = ["pipe", "not a regular file", "Save the stream to a file first"];
        yield return new("9 check of a FIFO as the matrix", s => ["check", s.Fifo("m.csv"), "--samples", s.Sheet(), "--outcome", "status"],
            ExitCode.InputError, ["m.csv", "the matrix", .. refusal]);
        yield return new("9 screen of a FIFO as the matrix", s => ["screen", s.Fifo("m.csv"), "--samples", s.Sheet(), "--outcome", "status", "--out", s.PathOf("r"), "--quiet"],
            ExitCode.InputError, ["m.csv", "the matrix", .. refusal]);
        yield return new("9 grow with a FIFO as the sample sheet", s => ["grow", s.Panel(), "--samples", s.Fifo("s.csv"), "--outcome", "status"],
            ExitCode.InputError, ["s.csv", "the sample sheet", .. refusal]);
        yield return new("9 apply with a FIFO as the locked panel", s => ApplyInto(s, s.Fifo("locked_panel.json"), s.PathOf("applied")),
            ExitCode.InputError, ["locked_panel.json", "the locked panel", .. refusal]);
        yield return new("9 check of a link to a FIFO", s => ["check", s.Link("m.csv", s.Fifo("pipe")), "--samples", s.Sheet(), "--outcome", "status"],
            ExitCode.InputError, ["m.csv", .. refusal]);
    }

    /// <summary>Cases of finding 4: a locked marker the new cohort did not measure.</summary>
    public static IEnumerable<MisuseCase> UnmeasuredMarkerCases()
    {
        foreach (var (token, state) in new[] { ("NA", "missing in every sample"), ("<LOD", "below the detection limit in every sample") })
            yield return new($"4 apply with a locked marker {(token == "NA" ? "entirely missing" : "entirely below detection")}", s =>
                {
                    string model = Path.Combine(s.ScreenFolder("r"), "locked_panel.json");
                    string marker = LockedPanelFile.Read(model).MarkerNames[0];
                    return ApplyTo(WdbcWithColumnSetTo(s, marker, token), model, s.PathOf("applied"));
                },
                ExitCode.Success, ["warning:", state, "the scores rest on the other markers only", "calls would change"],
                Verify: (s, _) =>
                {
                    using var evaluation = System.Text.Json.JsonDocument.Parse(File.ReadAllText(s.PathOf("applied/evaluation.json")));
                    var warning = evaluation.RootElement.GetProperty("scale_warnings")[0];
                    Assert.True(warning.GetProperty("unmeasured").GetBoolean());
                    string report = File.ReadAllText(s.PathOf("applied/apply_report.html"));
                    Assert.DoesNotContain("Every marker", report);
                    Assert.Contains("measured in no sample of this cohort", report);
                });
    }

    /// <summary>A copy of the WDBC matrix with one column's every cell replaced by <paramref name="token"/>.</summary>
    private static string WdbcWithColumnSetTo(MisuseScene scene, string column, string token)
    {
        var lines = File.ReadAllLines(ReferenceData.Wdbc("wdbc.csv"));
        int index = Array.IndexOf(lines[0].Split(','), column);
        Assert.True(index > 0, $"no column {column}");
        var text = new StringBuilder(lines[0]).Append('\n');
        foreach (var line in lines.Skip(1))
        {
            var cells = line.Split(',');
            cells[index] = token;
            text.Append(string.Join(',', cells)).Append('\n');
        }
        return scene.File("unmeasured.csv", text.ToString());
    }

    /// <summary>Holds a folder's lock as a running screen would: the kernel lock on the lock file, and the holder record beside it.</summary>
    internal static IDisposable HoldLock(string folder)
    {
        var held = new FileStream(Path.Combine(folder, ".omicsscreen.lock"), FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
        File.WriteAllText(Path.Combine(folder, ".omicsscreen.lock.json"),
            $"{{\"process_id\":{Environment.ProcessId.ToString(CultureInfo.InvariantCulture)},\"started_utc\":\"2026-12-03T10:00:00.0000000Z\",\"machine\":\"here\"}}");
        return held;
    }

    /// <summary>The folder holds exactly the files its manifest lists, the manifest and <paramref name="others"/>.</summary>
    internal static void AssertFolderHoldsOnlyItsManifestOutputs(string folder, params string[] others)
    {
        using var manifest = System.Text.Json.JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "manifest.json")));
        var expected = manifest.RootElement.GetProperty("outputs").EnumerateArray().Select(o => o.GetString()!).ToHashSet();
        expected.Add("manifest.json");
        foreach (var other in others) expected.Add(other);
        var present = Directory.EnumerateFileSystemEntries(folder).Select(e => Path.GetFileName(e)!).ToHashSet();
        Assert.True(expected.SetEquals(present),
            $"the folder holds {string.Join(", ", present.Order())}; its manifest lists {string.Join(", ", expected.Order())}");
    }
}
