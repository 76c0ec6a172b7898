using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Cohorts;

namespace OmicsScreen.Runs.Results;

/// <summary>Writes the tables of a screen's cohort check into its results folder.</summary>
public static class CohortTableFiles
{
    public static void Write(ResultsFolder folder, CohortResult cohorts)
    {
        var names = ScreenResultFiles.CohortTables;
        folder.WriteText(names[0], w => CohortTables.WriteConcordance(w, cohorts));
        folder.WriteText(names[1], w => CohortTables.WriteMarkers(w, cohorts));
        folder.WriteText(names[2], w => CohortTables.WriteEffects(w, cohorts));
        folder.WriteText(names[3], w => CohortTables.WriteHeldOut(w, cohorts));
    }
}
