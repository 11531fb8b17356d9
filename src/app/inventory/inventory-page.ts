import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

interface SectionLink {
  path: string;
  label: string;
  icon: string;
}

/** The inventory's frame: one tab per kind of record, each a child route. */
@Component({
  selector: 'cw-inventory-page',
  imports: [MatIconModule, MatTabsModule, RouterLink, RouterLinkActive, RouterOutlet],
  templateUrl: './inventory-page.html',
  styleUrl: './inventory-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InventoryPage {
  protected readonly links: SectionLink[] = [
    { path: 'properties', label: 'Properties', icon: 'apartment' },
    { path: 'appliances', label: 'Appliances', icon: 'kitchen' },
    { path: 'sensors', label: 'Sensors', icon: 'sensors' },
    { path: 'contractors', label: 'Contractors', icon: 'handyman' },
    { path: 'coverage', label: 'Coverage', icon: 'grid_on' },
    { path: 'import', label: 'Import CSV', icon: 'upload_file' },
  ];
}
