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
    /// </summary>
    /// <param name="classesOnly">True for the steps that take class panels only in this version; the screen and grow take every outcome kind.</param>
    public LoadedPanel EnsureScreenable(bool classesOnly = true)
    {
        if (classesOnly) EnsureClasses();
        if (Inspection.CanScreen) return this;
        var message = new StringBuilder(Path.GetFileName(Inspection.MatrixPath)).Append(": the panel cannot be screened:");
        foreach (var finding in Inspection.Findings)
            if (finding.Severity == FindingSeverity.Error) message.Append(' ').Append(finding.Message);
        message.Append(" Run `omicsscreen check` on the same files for every finding.");
        throw new PanelNotScreenableException(message.ToString(), Inspection.MatrixPath);
    }

    /// <summary>
    /// Throws a <see cref="PanelNotScreenableException"/> unless the outcome is classes: locked
    /// panels (`apply`) of this version are built for classes only, and refusing before any
    /// work keeps a measured or time-to-event panel from half-writing a results folder.
    /// </summary>
    public LoadedPanel EnsureClasses()
    {
        if (Panel.Kind == OutcomeKind.Classes) return this;
        string kind = Panel.Kind == OutcomeKind.Measured
            ? $"the outcome '{Panel.OutcomeColumn}' is a measured quantity"
            : $"the outcome is a time to an event ('{Panel.OutcomeColumn}' and '{Panel.FollowUp!.EventColumn}')";
        throw new PanelNotScreenableException(
            $"{Path.GetFileName(Inspection.MatrixPath)}: {kind}, and in this version `apply` takes panels of classes only; `omicsscreen screen` screens this outcome. "
            + "`omicsscreen check` on the same files describes the outcome"
            + (Panel.Kind == OutcomeKind.Measured ? "; if its values are class labels, add --outcome-kind classes." : "."),
            Inspection.MatrixPath);
    }
}
