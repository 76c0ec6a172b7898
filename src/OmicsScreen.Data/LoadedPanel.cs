using System.Text;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data;

/// <summary>A panel as loaded, what the loader found in it, and the exact input files it came from.</summary>
public sealed class LoadedPanel
{
    public LoadedPanel(Panel panel, PanelInspection inspection, IReadOnlyList<InputFileRecord> inputs,
        FeatureDescriptions? features = null)
    {
        Panel = panel;
        Inspection = inspection;
        Inputs = inputs;
        Features = features ?? FeatureDescriptions.None(panel.Matrix.FeatureNames);
    }

    public Panel Panel { get; }

    /// <summary>Display names and annotations of the panel's features, in panel feature order.</summary>
    public FeatureDescriptions Features { get; }
    public PanelInspection Inspection { get; }
    public IReadOnlyList<InputFileRecord> Inputs { get; }

    /// <summary>
    /// Throws a <see cref="PanelNotScreenableException"/> carrying every Error finding (a single class, a
    /// class with one sample, all features constant, too few events) when the panel cannot be screened.
    /// Every outcome kind is accepted: screen, grow and apply handle classes, measured quantities and times to an event.
    /// </summary>
    public LoadedPanel EnsureScreenable()
    {
        if (Inspection.CanScreen) return this;
        var message = new StringBuilder(Path.GetFileName(Inspection.MatrixPath)).Append(": the panel cannot be screened:");
        foreach (var finding in Inspection.Findings)
            if (finding.Severity == FindingSeverity.Error) message.Append(' ').Append(finding.Message);
        message.Append(" Run `omicsscreen check` on the same files for every finding.");
        throw new PanelNotScreenableException(message.ToString(), Inspection.MatrixPath);
    }
}
