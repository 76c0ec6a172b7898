using System.Security.Cryptography;
using OmicsScreen.Engine.Panels;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Screening.Tests.Calibration;

/// <summary>
/// The class shapes and designs of the calibration suite draw exactly what they drew when the README's
/// class table was measured, so adding models of other outcome kinds cannot move a class row.
/// </summary>
public class ClassDrawFingerprintTests
{
    /// <summary>
    /// SHA-256 over the discovery panel and a 300-sample fresh cohort of seed number 1 (values, cell
    /// states, classes), taken on main at 4f16a18 before the models of other outcome kinds were added.
    /// </summary>
    [Theory]
    [InlineData("null-normal", "ABC21B539CF6A94754AE5985DF54DF8C73775CEA264304ECF73CC0A47CF59FC0")]
    [InlineData("null-blocks", "52D782F8638162E1C4FBC0C8BF188DC383FA3BAFCF305D7BAFA2B6E1C288FEFC")]
    [InlineData("null-imbalanced", "FD39C74922100EFB0EAE9FB88F6C701E2A4F14A784BF763C5302733D09133EDE")]
    [InlineData("null-censored", "B14FCA6F1513E69444EF50B284074961E8A27E84F63982096155F8E1C3EEFFC7")]
    [InlineData("null-heavy-tails", "BB93A9FEA240E2AE196326F16BE250359C49B27C18FE8802A6668CA90D30F07A")]
    [InlineData("null-wide", "325D0725CBEFAD617F745A88735E6049115994638FC0D8993D80DFA67760E951")]
    [InlineData("null-tall", "E88E60CACEA2A941AD08103DA3A4D535D79C503F708E1C9C0114E539001EC4A0")]
    [InlineData("null-three-classes", "ADB3F86F078B4CAEDA88FE17EDCE88B330060B7D45ADA5E6F40A51DA3789FBB1")]
    [InlineData("planted-blocks", "3B0589BC0089F228B22E9298A45E43047F2B0CA1BBD7B1A27EDAA720C0E55209")]
    [InlineData("planted-interaction", "3C93F5E23B4EB441B7D164315172C34059018477EA39AACEA099A239EB34A4B1")]
    [InlineData("planted-threshold", "2989BA56A4B1426840637B60F500EC3B9FCD9D5D826D8B3406A1C7228F1D8428")]
    public void A_class_design_draws_the_same_panels_as_before(string name, string expected)
    {
        var model = CalibrationCatalogue.Create(name, 1);
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        Add(hash, model.Discovery());
        Add(hash, model.DrawFreshCohort(300));
        string actual = Convert.ToHexString(hash.GetHashAndReset());
        Assert.True(actual == expected, $"{name} now draws {actual}");
    }

    private static void Add(IncrementalHash hash, Panel panel)
    {
        for (int f = 0; f < panel.FeatureCount; f++)
        {
            hash.AppendData(System.Runtime.InteropServices.MemoryMarshal.AsBytes(panel.Matrix.Column(f)));
            for (int s = 0; s < panel.SampleCount; s++) hash.AppendData([(byte)panel.Matrix.State(f, s)]);
        }
        hash.AppendData(System.Runtime.InteropServices.MemoryMarshal.AsBytes(panel.Outcome.SampleClasses));
    }
}
