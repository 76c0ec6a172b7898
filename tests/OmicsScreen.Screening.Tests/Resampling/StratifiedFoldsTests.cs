using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Resampling;

namespace OmicsScreen.Screening.Tests.Resampling;

public class StratifiedFoldsTests
{
    [Fact]
    public void Test_parts_of_one_repeat_partition_the_rows_and_training_is_the_rest()
    {
        var codes = Enumerable.Range(0, 53).Select(i => i % 4 == 0 ? 1 : 0).ToArray();
        var outcome = new ClassOutcome("status", ["control", "case"], codes);
        var rows = Enumerable.Range(0, 53).ToArray();
        var folds = StratifiedFolds.Draw(outcome, null, rows, foldCount: 5, repeatCount: 2, runSeed: 11);

        Assert.Equal(10, folds.Count);
        foreach (var repeat in folds.GroupBy(f => f.Repeat))
        {
            Assert.Equal(rows, repeat.SelectMany(f => f.TestRows).Order().ToArray());
            foreach (var fold in repeat)
            {
                Assert.Empty(fold.TrainingRows.Intersect(fold.TestRows));
                Assert.Equal(rows, fold.TrainingRows.Concat(fold.TestRows).Order().ToArray());
                Assert.InRange(fold.TestRows.Length, 10, 11);
                // 14 cases over 5 folds: 2 or 3 per fold (stratified).
                Assert.InRange(fold.TestRows.Count(r => codes[r] == 1), 2, 3);
            }
        }
        Assert.NotEqual(folds[0].TestRows, folds[5].TestRows);
    }

    [Fact]
    public void A_subject_is_never_split_between_training_and_test()
    {
        var subjectOf = Enumerable.Range(0, 40).Select(r => $"p{r / 2}").ToArray();
        var codes = Enumerable.Range(0, 40).Select(r => (r / 2) % 3 == 0 ? 1 : 0).ToArray();
        var outcome = new ClassOutcome("status", ["control", "case"], codes);
        var subject = SampleGrouping.FromLabels("subject", subjectOf);
        foreach (var fold in StratifiedFolds.Draw(outcome, subject, Enumerable.Range(0, 40).ToArray(), 4, 1, runSeed: 5))
        {
            var trainingSubjects = fold.TrainingRows.Select(r => subjectOf[r]).ToHashSet();
            Assert.DoesNotContain(fold.TestRows, r => trainingSubjects.Contains(subjectOf[r]));
        }
    }
}
