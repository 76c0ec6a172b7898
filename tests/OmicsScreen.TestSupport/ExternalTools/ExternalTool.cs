namespace OmicsScreen.TestSupport.ExternalTools;

/// <summary>Programs outside .NET that some tests drive; CI installs them with .ci/install-packages.</summary>
public enum ExternalTool
{
    /// <summary>Debian's headless Chromium, /usr/bin/chromium (report layout and browser checks).</summary>
    Chromium,
    /// <summary>pdftotext from poppler-utils, /usr/bin/pdftotext (the printed report's pages).</summary>
    PdfToText,
    /// <summary>snakemake on the PATH (the workflow examples).</summary>
    Snakemake,
    /// <summary>A single-node Slurm that workflows/slurm/ci_single_node.sh starts as root: only on CI.</summary>
    Slurm,
}
