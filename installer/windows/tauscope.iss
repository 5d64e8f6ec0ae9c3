; Inno Setup script for Tauscope: a per-user installer (no administrator rights).
;
; Build on Windows, from the repository root, after `python installer\build.py`:
;   "%ProgramFiles(x86)%\Inno Setup 6\ISCC.exe" /DAppVersion=0.1.0 installer\windows\tauscope.iss
; Output: dist\tauscope-<version>-windows-x86_64-setup.exe
;
; What it does for the user:
; - installs dist\tauscope\ into %LOCALAPPDATA%\Programs\Tauscope (per user: {autopf} with
;   PrivilegesRequired=lowest);
; - a Start-menu entry "Tauscope" (optional desktop icon);
; - opens .tauscope study files with Tauscope (HKCU\Software\Classes, per user);
; - an uninstaller, listed under Settings > Apps, that removes all of the above and
;   never touches the user's workbooks, studies or reports.
;
; Requires Inno Setup 6.3 or later (for x64compatible and {autoprograms}).

#define AppName "Tauscope"
#ifndef AppVersion
  #define AppVersion "0.1.0"
#endif
#define AppExeName "tauscope.exe"
#define StudyProgId "Tauscope.Study"
#define RepoRoot "..\.."

[Setup]
; AppId identifies the program to the uninstaller and to later versions: never change it.
AppId={{6F3C1B2E-8A4D-4C57-9E21-5B7D0A93C4F8}
AppName={#AppName}
AppVersion={#AppVersion}
AppVerName={#AppName} {#AppVersion}
AppPublisher=Tauscope developers
DefaultDirName={autopf}\{#AppName}
DefaultGroupName={#AppName}
DisableProgramGroupPage=yes
PrivilegesRequired=lowest
ArchitecturesAllowed=x64compatible
ArchitecturesInstallIn64BitMode=x64compatible
ChangesAssociations=yes
OutputDir={#RepoRoot}\dist
OutputBaseFilename=tauscope-{#AppVersion}-windows-x86_64-setup
SetupIconFile={#RepoRoot}\resources\icons\tauscope.ico
UninstallDisplayIcon={app}\{#AppExeName}
UninstallDisplayName={#AppName} {#AppVersion}
Compression=lzma2/max
SolidCompression=yes
WizardStyle=modern
CloseApplications=yes

[Languages]
Name: "english"; MessagesFile: "compiler:Default.isl"

[Tasks]
Name: "desktopicon"; Description: "{cm:CreateDesktopIcon}"; GroupDescription: "{cm:AdditionalIcons}"; Flags: unchecked
Name: "studyfiles"; Description: "Open .tauscope study files with {#AppName}"; GroupDescription: "File types:"

[Files]
; The whole one-folder bundle: tauscope.exe (the window), tauscope-console.exe (the same
; program for the command line: batch, snapshot, self-test) and _internal\.
Source: "{#RepoRoot}\dist\tauscope\*"; DestDir: "{app}"; Flags: ignoreversion recursesubdirs createallsubdirs

[InstallDelete]
; An upgrade replaces the bundle completely, so no file of an older version lingers.
Type: filesandordirs; Name: "{app}\_internal"

[Icons]
Name: "{autoprograms}\{#AppName}"; Filename: "{app}\{#AppExeName}"; Comment: "Unit-root testing and order of integration"
Name: "{autodesktop}\{#AppName}"; Filename: "{app}\{#AppExeName}"; Tasks: desktopicon

[Registry]
; Per-user file type: HKA is HKCU for a per-user install.
Root: HKA; Subkey: "Software\Classes\.tauscope"; ValueType: string; ValueName: ""; ValueData: "{#StudyProgId}"; Flags: uninsdeletevalue; Tasks: studyfiles
Root: HKA; Subkey: "Software\Classes\.tauscope\OpenWithProgids"; ValueType: string; ValueName: "{#StudyProgId}"; ValueData: ""; Flags: uninsdeletevalue; Tasks: studyfiles
Root: HKA; Subkey: "Software\Classes\{#StudyProgId}"; ValueType: string; ValueName: ""; ValueData: "Tauscope study"; Flags: uninsdeletekey; Tasks: studyfiles
Root: HKA; Subkey: "Software\Classes\{#StudyProgId}\DefaultIcon"; ValueType: string; ValueName: ""; ValueData: "{app}\{#AppExeName},0"; Tasks: studyfiles
Root: HKA; Subkey: "Software\Classes\{#StudyProgId}\shell\open\command"; ValueType: string; ValueName: ""; ValueData: """{app}\{#AppExeName}"" ""%1"""; Tasks: studyfiles
; "Open with" for workbooks, without taking them over from the spreadsheet program.
Root: HKA; Subkey: "Software\Classes\Applications\{#AppExeName}"; ValueType: string; ValueName: "FriendlyAppName"; ValueData: "{#AppName}"; Flags: uninsdeletekey
Root: HKA; Subkey: "Software\Classes\Applications\{#AppExeName}\shell\open\command"; ValueType: string; ValueName: ""; ValueData: """{app}\{#AppExeName}"" ""%1"""
Root: HKA; Subkey: "Software\Classes\Applications\{#AppExeName}\SupportedTypes"; ValueType: string; ValueName: ".tauscope"; ValueData: ""
Root: HKA; Subkey: "Software\Classes\Applications\{#AppExeName}\SupportedTypes"; ValueType: string; ValueName: ".xlsx"; ValueData: ""
Root: HKA; Subkey: "Software\Classes\Applications\{#AppExeName}\SupportedTypes"; ValueType: string; ValueName: ".csv"; ValueData: ""

[Run]
Filename: "{app}\{#AppExeName}"; Description: "{cm:LaunchProgram,{#AppName}}"; Flags: nowait postinstall skipifsilent
