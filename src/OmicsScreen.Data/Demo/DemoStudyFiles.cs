namespace OmicsScreen.Data.Demo;

/// <summary>Where the demo study's files were written.</summary>
public sealed record DemoStudyFiles(string Panel, string SampleSheet, string Truth, string Readme, string FeatureSheet);
